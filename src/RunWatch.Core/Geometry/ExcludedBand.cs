namespace RunWatch.Core.Geometry;

/// <summary>
/// An axis-aligned rectangle of the field in which wires cannot be seen (for example the instrument's information
/// strip at the bottom of an SEM image). Wires may hide in it, so zones that could reach it are guarded.
/// </summary>
/// <param name="MinX">Left edge.</param>
/// <param name="MinY">Top edge (smaller y).</param>
/// <param name="MaxX">Right edge.</param>
/// <param name="MaxY">Bottom edge (larger y).</param>
public readonly record struct ExcludedBand(double MinX, double MinY, double MaxX, double MaxY)
{
    /// <summary>A band across the whole field width, from <paramref name="minY"/> to <paramref name="maxY"/>.</summary>
    public static ExcludedBand Horizontal(double fieldMinX, double fieldMaxX, double minY, double maxY) =>
        new(fieldMinX, minY, fieldMaxX, maxY);

    /// <summary>Squared distance from (x, y) to the band; 0 inside it.</summary>
    internal double DistanceSquaredTo(double x, double y)
    {
        double dx = x < MinX ? MinX - x : (x > MaxX ? x - MaxX : 0.0);
        double dy = y < MinY ? MinY - y : (y > MaxY ? y - MaxY : 0.0);
        return (dx * dx) + (dy * dy);
    }
}
