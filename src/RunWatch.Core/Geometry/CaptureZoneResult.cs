namespace RunWatch.Core.Geometry;

/// <summary>
/// Zones of every input point, in input order. Immutable; thread-safe to read.
/// </summary>
public sealed class CaptureZoneResult
{
    private readonly double[] _areas;
    private readonly bool[] _guarded;
    private readonly int[]? _outlineStart;
    private readonly Point2D[]? _outlineVertices;

    internal CaptureZoneResult(double diffusionLength, double[] areas, bool[] guarded, int[]? outlineStart, Point2D[]? outlineVertices)
    {
        DiffusionLength = diffusionLength;
        _areas = areas;
        _guarded = guarded;
        _outlineStart = outlineStart;
        _outlineVertices = outlineVertices;
        int unguarded = 0;
        for (int i = 0; i < guarded.Length; i++)
        {
            unguarded += guarded[i] ? 0 : 1;
        }
        UnguardedCount = unguarded;
    }

    /// <summary>The L used (points' unit); +∞ for plain Voronoi cells.</summary>
    public double DiffusionLength { get; }

    /// <summary>Number of points.</summary>
    public int Count => _areas.Length;

    /// <summary>Number of points whose zone is not guarded (the ones zone statistics use).</summary>
    public int UnguardedCount { get; }

    /// <summary>Zone areas, in input order.</summary>
    public ReadOnlySpan<double> Areas => _areas;

    /// <summary>Guard flags, in input order.</summary>
    public ReadOnlySpan<bool> Guarded => _guarded;

    /// <summary>Whether outlines were computed (<see cref="CaptureZoneOptions.IncludeOutlines"/>).</summary>
    public bool HasOutlines => _outlineStart is not null;

    /// <summary>Zone of point <paramref name="index"/>.</summary>
    public CaptureZone this[int index] => new(index, _areas[index], NormalisedArea(_areas[index]), _guarded[index]);

    /// <summary>Outline of zone <paramref name="index"/> (absolute coordinates, arcs sampled); throws if outlines were not requested.</summary>
    public ReadOnlySpan<Point2D> Outline(int index)
    {
        if (_outlineStart is null || _outlineVertices is null)
        {
            throw new InvalidOperationException("outlines were not requested (CaptureZoneOptions.IncludeOutlines)");
        }
        return _outlineVertices.AsSpan(_outlineStart[index], _outlineStart[index + 1] - _outlineStart[index]);
    }

    /// <summary>Areas of the unguarded zones, in input order.</summary>
    public double[] UnguardedAreas()
    {
        var result = new double[UnguardedCount];
        for (int i = 0, k = 0; i < _areas.Length; i++)
        {
            if (!_guarded[i])
            {
                result[k++] = _areas[i];
            }
        }
        return result;
    }

    /// <summary>Normalised areas Â = A/(πL²) of the unguarded zones; throws when L is infinite.</summary>
    public double[] UnguardedNormalisedAreas()
    {
        if (!double.IsFinite(DiffusionLength))
        {
            throw new InvalidOperationException("normalised area A/(πL²) needs a finite diffusion length; use UnguardedAreas");
        }
        double[] result = UnguardedAreas();
        for (int i = 0; i < result.Length; i++)
        {
            result[i] = NormalisedArea(result[i]);
        }
        return result;
    }

    private double NormalisedArea(double area) =>
        double.IsFinite(DiffusionLength) ? area / (Math.PI * DiffusionLength * DiffusionLength) : double.NaN;
}
