namespace RunWatch.Core.Geometry;

/// <summary>
/// Computes zones one point at a time with buffers it owns (one worker per thread, nothing allocated per point
/// except outline output). The cell starts as the clip rectangle (∩ the square of half-side L) and is cut by the
/// bisector half-planes of neighbours taken ring by ring from the grid, until no farther neighbour can cut: a
/// neighbour at distance d cuts only if d &lt; 2·R, R = the largest distance from the point to the cell (at most L)
/// (the security-radius criterion, COMMON PRACTICE in incremental Voronoi construction).
/// </summary>
internal sealed partial class CaptureZoneWorker
{
    private readonly PointGrid _grid;
    private readonly double _length;
    private readonly bool _finite;
    private readonly double _arcStep;
    private readonly GuardRule _guardRule;
    private readonly double _clipMinX, _clipMinY, _clipMaxX, _clipMaxY;
    private readonly double _edgeTolerance;
    private double[] _xs = new double[64];
    private double[] _ys = new double[64];
    private double[] _xsNext = new double[64];
    private double[] _ysNext = new double[64];
    private double[] _side = new double[64];
    private int _count;

    public CaptureZoneWorker(PointGrid grid, double diffusionLength, double arcStepRadians, GuardRule guardRule)
    {
        _guardRule = guardRule;
        _grid = grid;
        _length = diffusionLength;
        _finite = double.IsFinite(diffusionLength);
        _arcStep = arcStepRadians;
        (_clipMinX, _clipMinY, _clipMaxX, _clipMaxY) = grid.Field.ClipRegion();
        _edgeTolerance = 1e-9 * (grid.Field.Width + grid.Field.Height);
    }

    /// <summary>Computes the zone of the point in <paramref name="slot"/>; appends its outline when <paramref name="outline"/> is set.</summary>
    public (double Area, bool Guarded) Compute(int slot, List<Point2D>? outline)
    {
        double px = _grid.X[slot], py = _grid.Y[slot];
        CaptureField field = _grid.Field;
        if (!StartPolygon(px, py))
        {
            return (0.0, true);
        }
        CutByNeighbours(slot, px, py);

        double reach2 = MaxVertexDistanceSquared();
        double area;
        bool insideDisc = !_finite || reach2 <= _length * _length;
        ReadOnlySpan<double> xs = _xs.AsSpan(0, _count), ys = _ys.AsSpan(0, _count);
        area = insideDisc ? ConvexPolygonMath.Area(xs, ys) : ConvexPolygonMath.DiscIntersectionArea(xs, ys, _length);

        bool guarded = !field.Periodic && (_guardRule == GuardRule.UnseenNeighbourCouldCut
            ? UnseenNeighbourCouldCut(px, py, EffectiveReachSquared())
            : IsGuarded(px, py));
        if (outline is not null)
        {
            if (insideDisc)
            {
                for (int i = 0; i < _count; i++)
                {
                    outline.Add(new Point2D(_xs[i] + px, _ys[i] + py));
                }
            }
            else
            {
                ConvexPolygonMath.AppendDiscIntersectionOutline(xs, ys, _length, _arcStep, px, py, outline);
            }
        }
        return (area, guarded);
    }

    private bool StartPolygon(double px, double py)
    {
        CaptureField field = _grid.Field;
        double x0, y0, x1, y1;
        if (field.Periodic)
        {
            // Own images one period away cut the cell to at most half a period either side.
            x0 = -0.5 * field.Width;
            x1 = 0.5 * field.Width;
            y0 = -0.5 * field.Height;
            y1 = 0.5 * field.Height;
        }
        else
        {
            x0 = _clipMinX - px;
            x1 = _clipMaxX - px;
            y0 = _clipMinY - py;
            y1 = _clipMaxY - py;
        }
        if (_finite)
        {
            x0 = Math.Max(x0, -_length);
            y0 = Math.Max(y0, -_length);
            x1 = Math.Min(x1, _length);
            y1 = Math.Min(y1, _length);
        }
        if (!(x1 > x0) || !(y1 > y0))
        {
            _count = 0;
            return false;
        }
        // Counter-clockwise in a y-up frame; orientation only fixes the sign of the areas, which stay positive.
        _xs[0] = x0;
        _ys[0] = y0;
        _xs[1] = x1;
        _ys[1] = y0;
        _xs[2] = x1;
        _ys[2] = y1;
        _xs[3] = x0;
        _ys[3] = y1;
        _count = 4;
        return true;
    }

    private void CutByNeighbours(int slot, double px, double py)
    {
        PointGrid g = _grid;
        bool periodic = g.Field.Periodic;
        int cx = g.CellX(px), cy = g.CellY(py);
        double reach2 = EffectiveReachSquared();
        for (int ring = 0; ; ring++)
        {
            double bound = g.RingLowerBound(px, py, cx, cy, ring);
            if (bound * bound >= 4.0 * reach2)
            {
                return;
            }
            if (!periodic && ring > 0 && g.RingOutsideGrid(cx, cy, ring))
            {
                return;
            }
            for (int dy = -ring; dy <= ring; dy++)
            {
                bool fullRow = dy == -ring || dy == ring;
                int stepX = fullRow ? 1 : Math.Max(1, 2 * ring);
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
                    int end = g.CellStart[cell + 1];
                    bool ownImage = shiftX == 0.0 && shiftY == 0.0;
                    for (int t = g.CellStart[cell]; t < end; t++)
                    {
                        if (t == slot && ownImage)
                        {
                            continue;
                        }
                        double qx = g.X[t] + shiftX - px, qy = g.Y[t] + shiftY - py;
                        double d2 = (qx * qx) + (qy * qy);
                        if (d2 >= 4.0 * reach2)
                        {
                            continue;
                        }
                        if (d2 == 0.0)
                        {
                            throw new ArgumentException(
                                $"points {g.Index[slot]} and {g.Index[t]} coincide at ({px}, {py}); capture zones need distinct points");
                        }
                        if (ClipHalfPlane(qx, qy, 0.5 * d2))
                        {
                            reach2 = EffectiveReachSquared();
                        }
                    }
                }
            }
        }
    }

    /// <summary>Keeps the part of the polygon with z·q ≤ c (the side of the bisector nearer the point). Returns true if it cut.</summary>
    private bool ClipHalfPlane(double qx, double qy, double c)
    {
        int n = _count;
        bool anyOutside = false;
        for (int i = 0; i < n; i++)
        {
            double s = (_xs[i] * qx) + (_ys[i] * qy) - c;
            _side[i] = s;
            anyOutside |= s > 0.0;
        }
        if (!anyOutside)
        {
            return false;
        }
        EnsureCapacity(n + 2);
        int m = 0;
        for (int i = 0; i < n; i++)
        {
            int j = i + 1 == n ? 0 : i + 1;
            double si = _side[i], sj = _side[j];
            if (si <= 0.0)
            {
                _xsNext[m] = _xs[i];
                _ysNext[m] = _ys[i];
                m++;
            }
            if ((si <= 0.0) != (sj <= 0.0))
            {
                double t = si / (si - sj);
                _xsNext[m] = _xs[i] + (t * (_xs[j] - _xs[i]));
                _ysNext[m] = _ys[i] + (t * (_ys[j] - _ys[i]));
                m++;
            }
        }
        (_xs, _xsNext) = (_xsNext, _xs);
        (_ys, _ysNext) = (_ysNext, _ys);
        _count = m;
        return true;
    }

    private void EnsureCapacity(int needed)
    {
        if (needed <= _xsNext.Length)
        {
            return;
        }
        int size = Math.Max(needed, 2 * _xsNext.Length);
        Array.Resize(ref _xs, size);
        Array.Resize(ref _ys, size);
        Array.Resize(ref _side, size);
        _xsNext = new double[size];
        _ysNext = new double[size];
    }

    private double MaxVertexDistanceSquared()
    {
        double max = 0.0;
        for (int i = 0; i < _count; i++)
        {
            double d2 = (_xs[i] * _xs[i]) + (_ys[i] * _ys[i]);
            if (d2 > max)
            {
                max = d2;
            }
        }
        return max;
    }

    /// <summary>Largest distance² from the point to its zone: the cell's farthest vertex, capped by L².</summary>
    private double EffectiveReachSquared()
    {
        double r2 = MaxVertexDistanceSquared();
        return _finite ? Math.Min(r2, _length * _length) : r2;
    }
}
