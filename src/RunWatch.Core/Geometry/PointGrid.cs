namespace RunWatch.Core.Geometry;

/// <summary>
/// Uniform bucket grid over a field: points sorted by cell (compressed rows), so a ring of cells around a query is
/// a few contiguous slices. About two points per cell on average. Immutable after construction; thread-safe to read.
/// </summary>
internal sealed class PointGrid
{
    private const double PointsPerCell = 2.0;
    private const int MaxCellsPerAxis = 8192;

    public PointGrid(ReadOnlySpan<Point2D> points, CaptureField field)
    {
        ArgumentNullException.ThrowIfNull(field);
        Field = field;
        Count = points.Length;
        // A periodic grid must tile the box so that cells wrap; a plain one covers only the points' bounding box,
        // so points crowded into part of a large field still get about two per cell.
        (double x0, double y0, double width, double height) = field.Periodic || points.Length == 0
            ? (field.MinX, field.MinY, field.Width, field.Height)
            : BoundingBox(points, field);
        OriginX = x0;
        OriginY = y0;
        double cellSide = Math.Sqrt(width * height * PointsPerCell / Math.Max(1, points.Length));
        CellsX = (int)Math.Clamp(Math.Ceiling(width / cellSide), 1, MaxCellsPerAxis);
        CellsY = (int)Math.Clamp(Math.Ceiling(height / cellSide), 1, MaxCellsPerAxis);
        CellWidth = width / CellsX;
        CellHeight = height / CellsY;

        CellStart = new int[(CellsX * CellsY) + 1];
        var cellOfPoint = new int[points.Length];
        for (int i = 0; i < points.Length; i++)
        {
            double x = points[i].X, y = points[i].Y;
            if (!double.IsFinite(x) || !double.IsFinite(y))
            {
                throw new ArgumentException($"point {i} has a non-finite coordinate ({x}, {y})", nameof(points));
            }
            if (x < field.MinX || x > field.MaxX || y < field.MinY || y > field.MaxY)
            {
                throw new ArgumentException(
                    $"point {i} ({x}, {y}) lies outside the field [{field.MinX}, {field.MaxX}] × [{field.MinY}, {field.MaxY}]",
                    nameof(points));
            }
            int c = (CellY(y) * CellsX) + CellX(x);
            cellOfPoint[i] = c;
            CellStart[c + 1]++;
        }
        for (int c = 0; c < CellsX * CellsY; c++)
        {
            CellStart[c + 1] += CellStart[c];
        }
        X = new double[points.Length];
        Y = new double[points.Length];
        Index = new int[points.Length];
        SlotOfPoint = new int[points.Length];
        var fill = new int[CellsX * CellsY];
        for (int i = 0; i < points.Length; i++)
        {
            int c = cellOfPoint[i];
            int slot = CellStart[c] + fill[c]++;
            X[slot] = points[i].X;
            Y[slot] = points[i].Y;
            Index[slot] = i;
            SlotOfPoint[i] = slot;
        }
    }

    /// <summary>Bounding box of the points, at least a small fraction of the field wide in each direction.</summary>
    private static (double X0, double Y0, double Width, double Height) BoundingBox(ReadOnlySpan<Point2D> points, CaptureField field)
    {
        double minX = double.PositiveInfinity, minY = double.PositiveInfinity;
        double maxX = double.NegativeInfinity, maxY = double.NegativeInfinity;
        foreach (Point2D p in points)
        {
            minX = Math.Min(minX, p.X);
            maxX = Math.Max(maxX, p.X);
            minY = Math.Min(minY, p.Y);
            maxY = Math.Max(maxY, p.Y);
        }
        if (!double.IsFinite(minX) || !double.IsFinite(maxX) || !double.IsFinite(minY) || !double.IsFinite(maxY))
        {
            // Non-finite input is reported point by point below; the field keeps the arithmetic finite meanwhile.
            return (field.MinX, field.MinY, field.Width, field.Height);
        }
        double floor = 1e-6 * (field.Width + field.Height);
        return (minX, minY, Math.Max(maxX - minX, floor), Math.Max(maxY - minY, floor));
    }

    public CaptureField Field { get; }

    public int Count { get; }

    public double OriginX { get; }

    public double OriginY { get; }

    public int CellsX { get; }

    public int CellsY { get; }

    public double CellWidth { get; }

    public double CellHeight { get; }

    /// <summary>Slots of cell c are CellStart[c] .. CellStart[c+1]-1 (cells in row-major order).</summary>
    public int[] CellStart { get; }

    /// <summary>Coordinates by slot.</summary>
    public double[] X { get; }

    public double[] Y { get; }

    /// <summary>Caller's point index by slot.</summary>
    public int[] Index { get; }

    /// <summary>Slot by caller's point index.</summary>
    public int[] SlotOfPoint { get; }

    public int CellX(double x) => Math.Clamp((int)((x - OriginX) / CellWidth), 0, CellsX - 1);

    public int CellY(double y) => Math.Clamp((int)((y - OriginY) / CellHeight), 0, CellsY - 1);

    /// <summary>
    /// Lower bound on the distance from (x, y), which lies in cell (cx, cy), to any point in ring
    /// <paramref name="ring"/> (cells at Chebyshev distance exactly ring) or beyond.
    /// </summary>
    public double RingLowerBound(double x, double y, int cx, int cy, int ring)
    {
        if (ring <= 0)
        {
            return 0.0;
        }
        double left = x - (OriginX + ((cx - ring + 1) * CellWidth));
        double right = OriginX + ((cx + ring) * CellWidth) - x;
        double top = y - (OriginY + ((cy - ring + 1) * CellHeight));
        double bottom = OriginY + ((cy + ring) * CellHeight) - y;
        return Math.Max(0.0, Math.Min(Math.Min(left, right), Math.Min(top, bottom)));
    }

    /// <summary>True when, without wrap-around, ring <paramref name="ring"/> around (cx, cy) lies wholly outside the grid.</summary>
    public bool RingOutsideGrid(int cx, int cy, int ring) =>
        cx - ring < 0 && cx + ring >= CellsX && cy - ring < 0 && cy + ring >= CellsY;
}
