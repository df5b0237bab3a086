namespace RunWatch.Core.Geometry;

/// <summary>
/// The rectangle in which wires were observed (one SEM field), in the same length unit as the points.
/// </summary>
/// <remarks>
/// With <see cref="Periodic"/> the rectangle is a torus (opposite edges meet): no edge, no guard zone. That is
/// for statistics on simulated patterns, never for real images.
/// </remarks>
public sealed record CaptureField
{
    /// <summary>Creates a field; throws <see cref="ArgumentException"/> for an empty or non-finite rectangle.</summary>
    public CaptureField(double minX, double minY, double maxX, double maxY, ExcludedBand? band = null, bool periodic = false)
    {
        if (!double.IsFinite(minX) || !double.IsFinite(minY) || !double.IsFinite(maxX) || !double.IsFinite(maxY))
        {
            throw new ArgumentException("field bounds must be finite numbers");
        }
        if (!(maxX > minX) || !(maxY > minY))
        {
            throw new ArgumentException($"field must have positive width and height (got {maxX - minX} × {maxY - minY})");
        }
        if (periodic && band is not null)
        {
            throw new ArgumentException("a periodic field cannot have an excluded band");
        }
        if (band is { } b && (!double.IsFinite(b.MinX) || !double.IsFinite(b.MinY) || !double.IsFinite(b.MaxX)
            || !double.IsFinite(b.MaxY) || b.MaxX < b.MinX || b.MaxY < b.MinY))
        {
            throw new ArgumentException("excluded band must be a finite rectangle with Max >= Min");
        }
        MinX = minX;
        MinY = minY;
        MaxX = maxX;
        MaxY = maxY;
        Band = band;
        Periodic = periodic;
    }

    /// <summary>A field [0, width] × [0, height] with an optional excluded band.</summary>
    public static CaptureField Rectangle(double width, double height, ExcludedBand? band = null) =>
        new(0, 0, width, height, band);

    /// <summary>A periodic box [0, width) × [0, height) (torus), for statistics on simulated patterns.</summary>
    public static CaptureField PeriodicBox(double width, double height) => new(0, 0, width, height, null, periodic: true);

    public double MinX { get; }

    public double MinY { get; }

    public double MaxX { get; }

    public double MaxY { get; }

    /// <summary>Region where wires cannot be seen, or null.</summary>
    public ExcludedBand? Band { get; }

    /// <summary>True when opposite edges are identified (torus).</summary>
    public bool Periodic { get; }

    public double Width => MaxX - MinX;

    public double Height => MaxY - MinY;

    /// <summary>Area of the rectangle (the band included).</summary>
    public double Area => Width * Height;

    /// <summary>
    /// The convex region zones are clipped to: the rectangle, shrunk by the band when the band spans a whole side
    /// (the usual information strip). A band inside the field is not cut out (the region would not be convex);
    /// zones near it are guarded anyway.
    /// </summary>
    internal (double MinX, double MinY, double MaxX, double MaxY) ClipRegion()
    {
        double x0 = MinX, y0 = MinY, x1 = MaxX, y1 = MaxY;
        if (Band is { } b)
        {
            bool fullWidth = b.MinX <= MinX && b.MaxX >= MaxX;
            bool fullHeight = b.MinY <= MinY && b.MaxY >= MaxY;
            if (fullWidth && b.MaxY >= MaxY && b.MinY > MinY)
            {
                y1 = Math.Min(y1, b.MinY);
            }
            else if (fullWidth && b.MinY <= MinY && b.MaxY < MaxY)
            {
                y0 = Math.Max(y0, b.MaxY);
            }
            else if (fullHeight && b.MaxX >= MaxX && b.MinX > MinX)
            {
                x1 = Math.Min(x1, b.MinX);
            }
            else if (fullHeight && b.MinX <= MinX && b.MaxX < MaxX)
            {
                x0 = Math.Max(x0, b.MaxX);
            }
        }
        return (x0, y0, x1, y1);
    }
}
