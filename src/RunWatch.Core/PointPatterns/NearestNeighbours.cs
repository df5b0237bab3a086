using RunWatch.Core.Geometry;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Nearest-neighbour distances, grid-accelerated: rings of grid cells are searched outwards until the ring's
/// lower distance bound exceeds the best distance found. In a periodic field distances wrap around (a point's
/// own images count, so a lone point's neighbour is itself one period away).
/// </summary>
public static class NearestNeighbours
{
    /// <summary>Distance from each point to its nearest other point (+∞ for a lone point in a plain field).</summary>
    public static double[] Distances(ReadOnlySpan<Point2D> points, CaptureField field, CancellationToken cancellationToken = default)
    {
        var distances = new double[points.Length];
        var neighbours = new int[points.Length];
        Compute(points, field, distances, neighbours, cancellationToken);
        return distances;
    }

    /// <summary>
    /// Fills <paramref name="distances"/> and <paramref name="neighbours"/> (index of the nearest point, −1 if
    /// none), in input order. Spans must be as long as <paramref name="points"/>.
    /// </summary>
    /// <exception cref="OperationCanceledException"><paramref name="cancellationToken"/> was cancelled (checked every 64 points and 64 rings).</exception>
    public static void Compute(ReadOnlySpan<Point2D> points, CaptureField field, Span<double> distances, Span<int> neighbours, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(field);
        if (distances.Length != points.Length || neighbours.Length != points.Length)
        {
            throw new ArgumentException("distances and neighbours must be as long as points");
        }
        var grid = new PointGrid(points, field);
        for (int slot = 0; slot < grid.Count; slot++)
        {
            if ((slot & 63) == 0)
            {
                cancellationToken.ThrowIfCancellationRequested();
            }
            (double d2, int nearest) = Nearest(grid, slot, cancellationToken);
            int index = grid.Index[slot];
            distances[index] = Math.Sqrt(d2);
            neighbours[index] = nearest;
        }
    }

    private static (double DistanceSquared, int Index) Nearest(PointGrid g, int slot, CancellationToken cancellationToken)
    {
        bool periodic = g.Field.Periodic;
        double px = g.X[slot], py = g.Y[slot];
        int cx = g.CellX(px), cy = g.CellY(py);
        double best = double.PositiveInfinity;
        int bestIndex = -1;
        for (int ring = 0; ; ring++)
        {
            // A degenerate grid (cells far smaller than the spacing) needs many rings: stay stoppable.
            if ((ring & 63) == 63)
            {
                cancellationToken.ThrowIfCancellationRequested();
            }
            double bound = g.RingLowerBound(px, py, cx, cy, ring);
            if (bound * bound > best)
            {
                break;
            }
            if (!periodic && ring > 0 && g.RingOutsideGrid(cx, cy, ring))
            {
                break;
            }
            for (int dy = -ring; dy <= ring; dy++)
            {
                int stepX = dy == -ring || dy == ring ? 1 : Math.Max(1, 2 * ring);
                for (int dx = -ring; dx <= ring; dx += stepX)
                {
                    int gx = cx + dx, gy = cy + dy;
                    double shiftX = 0.0, shiftY = 0.0;
                    if (periodic)
                    {
                        int wx = ((gx % g.CellsX) + g.CellsX) % g.CellsX;
                        int wy = ((gy % g.CellsY) + g.CellsY) % g.CellsY;
                        shiftX = (gx - wx) / g.CellsX * g.Field.Width;
                        shiftY = (gy - wy) / g.CellsY * g.Field.Height;
                        gx = wx;
                        gy = wy;
                    }
                    else if (gx < 0 || gx >= g.CellsX || gy < 0 || gy >= g.CellsY)
                    {
                        continue;
                    }
                    int cell = (gy * g.CellsX) + gx;
                    bool ownImage = shiftX == 0.0 && shiftY == 0.0;
                    for (int t = g.CellStart[cell]; t < g.CellStart[cell + 1]; t++)
                    {
                        if (t == slot && ownImage)
                        {
                            continue;
                        }
                        double qx = g.X[t] + shiftX - px, qy = g.Y[t] + shiftY - py;
                        double d2 = (qx * qx) + (qy * qy);
                        if (d2 < best)
                        {
                            best = d2;
                            bestIndex = g.Index[t];
                        }
                    }
                }
            }
        }
        return (best, bestIndex);
    }
}
