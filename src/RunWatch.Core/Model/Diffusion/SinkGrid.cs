using RunWatch.Core.Geometry;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// A field cut into square cells, each free substrate, part of one wire's footprint (a perfect sink) or outside (the
/// field edge or an excluded band). Stored with a one-cell ghost ring, row-major, so the solver's stencil never
/// needs a bounds check.
/// </summary>
/// <remarks>
/// A cell belongs to wire i when its centre lies within the wire's footprint radius; a wire too small to cover any
/// cell centre gets the one cell that holds its centre, so no wire vanishes. Where footprints overlap the nearer
/// centre wins. The field is cut to whole cells: nx = ⌊width/h⌋, ny = ⌊height/h⌋ from its lower-left corner; the
/// leftover strip (less than one cell) is treated as outside.
/// </remarks>
public sealed class SinkGrid
{
    /// <summary>Label of a free substrate cell.</summary>
    public const int Free = -1;

    /// <summary>Label of a cell outside the field or inside the excluded band.</summary>
    public const int Outside = -2;

    private readonly int[] _labels;
    private readonly int[] _footprintCells;
    private readonly Point2D[] _centres;
    private readonly double[] _radii;

    private SinkGrid(int nx, int ny, double cellSize, double originX, double originY, ReadOnlySpan<Point2D> centres, ReadOnlySpan<double> radii, bool periodic)
    {
        int wireCount = centres.Length;
        _centres = centres.ToArray();
        _radii = radii.ToArray();
        Nx = nx;
        Ny = ny;
        CellSize = cellSize;
        OriginX = originX;
        OriginY = originY;
        WireCount = wireCount;
        Periodic = periodic;
        _labels = new int[(nx + 2) * (ny + 2)];
        _footprintCells = new int[wireCount];
    }

    /// <summary>Cells across.</summary>
    public int Nx { get; }

    /// <summary>Cells down.</summary>
    public int Ny { get; }

    /// <summary>Row stride of the padded arrays (Nx + 2).</summary>
    public int Stride => Nx + 2;

    /// <summary>Cell side, in the caller's length unit.</summary>
    public double CellSize { get; }

    /// <summary>Lower-left corner of cell (0, 0).</summary>
    public double OriginX { get; }

    /// <summary>Lower-left corner of cell (0, 0).</summary>
    public double OriginY { get; }

    /// <summary>Number of wires.</summary>
    public int WireCount { get; }

    /// <summary>True for a torus (from a periodic <see cref="CaptureField"/>).</summary>
    public bool Periodic { get; }

    /// <summary>Padded labels: <see cref="Free"/>, <see cref="Outside"/> or a wire index.</summary>
    public ReadOnlySpan<int> Labels => _labels;

    /// <summary>Cells in each wire's footprint.</summary>
    public ReadOnlySpan<int> FootprintCells => _footprintCells;

    /// <summary>Wire centres as given.</summary>
    public ReadOnlySpan<Point2D> Centres => _centres;

    /// <summary>Footprint radii as given.</summary>
    public ReadOnlySpan<double> Radii => _radii;

    /// <summary>Padded index of cell (ix, iy).</summary>
    public int Index(int ix, int iy) => ix + 1 + ((iy + 1) * Stride);

    /// <summary>
    /// Where wire <paramref name="wire"/>'s circle crosses the segment from the centre of free cell (ix, iy) one cell
    /// along (dx, dy), as a fraction θ of the cell side in [<paramref name="minimum"/>, 1]; 1 when the circle does not
    /// cross it (a footprint smaller than a cell). Periodic grids measure to the nearest image.
    /// </summary>
    public double BoundaryFraction(int ix, int iy, int dx, int dy, int wire, double minimum)
    {
        double cx = OriginX + ((ix + 0.5) * CellSize), cy = OriginY + ((iy + 0.5) * CellSize);
        double px = _centres[wire].X, py = _centres[wire].Y;
        double ox = cx - px, oy = cy - py;
        if (Periodic)
        {
            double w = Nx * CellSize, h = Ny * CellSize;
            ox -= w * Math.Round(ox / w);
            oy -= h * Math.Round(oy / h);
        }
        double r = _radii[wire];
        // |o + t·e|² = r² with e the unit step: t² + 2(o·e)t + |o|² − r² = 0; the nearer positive root.
        double half = (ox * dx) + (oy * dy);
        double c = (ox * ox) + (oy * oy) - (r * r);
        double disc = (half * half) - c;
        if (disc < 0)
        {
            return 1.0;
        }
        double t = -half - Math.Sqrt(disc);
        if (!(t > 0) || t > CellSize)
        {
            return 1.0;
        }
        return Math.Max(t / CellSize, minimum);
    }

    /// <summary>Number of free cells.</summary>
    public int FreeCellCount { get; private set; }

    /// <summary>
    /// Rasterises <paramref name="centres"/> with footprint radii <paramref name="radii"/> in <paramref name="field"/>
    /// at cell side <paramref name="cellSize"/> (all in one length unit).
    /// </summary>
    /// <exception cref="ArgumentException">Mismatched spans, a non-positive or non-finite cell size or radius, a centre
    /// outside the field, or more than 50 million cells.</exception>
    public static SinkGrid Rasterise(ReadOnlySpan<Point2D> centres, ReadOnlySpan<double> radii, CaptureField field, double cellSize)
    {
        ArgumentNullException.ThrowIfNull(field);
        if (centres.Length != radii.Length)
        {
            throw new ArgumentException($"{centres.Length} centres but {radii.Length} radii.", nameof(radii));
        }
        if (!(cellSize > 0) || !double.IsFinite(cellSize))
        {
            throw new ArgumentException($"Cell size must be a positive number (got {cellSize}).", nameof(cellSize));
        }
        int nx = (int)Math.Floor((field.Width / cellSize) + 1e-9);
        int ny = (int)Math.Floor((field.Height / cellSize) + 1e-9);
        if (nx < 3 || ny < 3)
        {
            throw new ArgumentException($"The field holds only {nx} × {ny} cells of {cellSize}; at least 3 × 3 are needed.", nameof(cellSize));
        }
        if ((long)nx * ny > 50_000_000)
        {
            throw new ArgumentException($"{nx} × {ny} cells is more than the 50 million this solver accepts; use larger cells.", nameof(cellSize));
        }
        var grid = new SinkGrid(nx, ny, cellSize, field.MinX, field.MinY, centres, radii, field.Periodic);
        grid.Fill(centres, radii, field);
        return grid;
    }

    private void Fill(ReadOnlySpan<Point2D> centres, ReadOnlySpan<double> radii, CaptureField field)
    {
        int stride = Stride;
        Array.Fill(_labels, Outside);
        for (int iy = 0; iy < Ny; iy++)
        {
            double y = OriginY + ((iy + 0.5) * CellSize);
            int row = (iy + 1) * stride;
            for (int ix = 0; ix < Nx; ix++)
            {
                double x = OriginX + ((ix + 0.5) * CellSize);
                bool hidden = field.Band is { } b && x >= b.MinX && x <= b.MaxX && y >= b.MinY && y <= b.MaxY;
                _labels[row + ix + 1] = hidden ? Outside : Free;
            }
        }
        // Distance² of the owning centre per labelled cell, so overlapping footprints go to the nearer wire.
        var owner = new Dictionary<int, double>();
        for (int w = 0; w < centres.Length; w++)
        {
            Point2D c = centres[w];
            double r = radii[w];
            if (!double.IsFinite(c.X) || !double.IsFinite(c.Y) || c.X < field.MinX || c.X > field.MaxX || c.Y < field.MinY || c.Y > field.MaxY)
            {
                throw new ArgumentException($"Wire {w} at ({c.X}, {c.Y}) lies outside the field.", nameof(centres));
            }
            if (!(r >= 0) || !double.IsFinite(r))
            {
                throw new ArgumentException($"Wire {w} has footprint radius {r}; it must be a finite number ≥ 0.", nameof(radii));
            }
            double fx = (c.X - OriginX) / CellSize;
            double fy = (c.Y - OriginY) / CellSize;
            int x0 = (int)Math.Floor(fx - (r / CellSize)), x1 = (int)Math.Ceiling(fx + (r / CellSize));
            int y0 = (int)Math.Floor(fy - (r / CellSize)), y1 = (int)Math.Ceiling(fy + (r / CellSize));
            bool any = false;
            for (int iy = y0; iy <= y1; iy++)
            {
                for (int ix = x0; ix <= x1; ix++)
                {
                    double dx = (ix + 0.5 - fx) * CellSize, dy = (iy + 0.5 - fy) * CellSize;
                    double d2 = (dx * dx) + (dy * dy);
                    if (d2 <= r * r && TryClaim(ix, iy, w, d2, owner))
                    {
                        any = true;
                    }
                }
            }
            if (!any)
            {
                int ix = Math.Clamp((int)Math.Floor(fx), 0, Nx - 1), iy = Math.Clamp((int)Math.Floor(fy), 0, Ny - 1);
                double dx = (ix + 0.5 - fx) * CellSize, dy = (iy + 0.5 - fy) * CellSize;
                TryClaim(ix, iy, w, (dx * dx) + (dy * dy), owner);
            }
        }
        Array.Clear(_footprintCells);
        int free = 0;
        foreach (int label in _labels)
        {
            if (label >= 0)
            {
                _footprintCells[label]++;
            }
            else if (label == Free)
            {
                free++;
            }
        }
        FreeCellCount = free;
    }

    private bool TryClaim(int ix, int iy, int wire, double d2, Dictionary<int, double> owner)
    {
        if (Periodic)
        {
            ix = ((ix % Nx) + Nx) % Nx;
            iy = ((iy % Ny) + Ny) % Ny;
        }
        else if (ix < 0 || iy < 0 || ix >= Nx || iy >= Ny)
        {
            return false;
        }
        int index = Index(ix, iy);
        int label = _labels[index];
        if (label == Outside)
        {
            return false;
        }
        if (label >= 0 && owner[index] <= d2)
        {
            return false;
        }
        _labels[index] = wire;
        owner[index] = d2;
        return true;
    }
}
