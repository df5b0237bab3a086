using MathNet.Numerics.Distributions;
using RunWatch.Core.Geometry;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Clark–Evans test of spatial randomness from nearest-neighbour distances. Source: Clark, P. J. &amp; Evans, F. C.
/// (1954) "Distance to nearest neighbor as a measure of spatial relationships in populations", Ecology 35, 445–453:
/// r̄_E = 1/(2√λ), σ = 0.26136/√(Nλ) with 0.26136 = √((4 − π)/(4π)). Edge treatment per <see cref="EdgeRule"/>.
/// </summary>
public static class ClarkEvans
{
    /// <summary>√((4 − π)/(4π)): standard deviation of the CSR nearest-neighbour distance times √λ.</summary>
    public static readonly double StandardErrorConstant = Math.Sqrt((4.0 - Math.PI) / (4.0 * Math.PI));

    /// <summary>Expected mean nearest-neighbour distance 1/(2√λ) for a Poisson pattern of density λ.</summary>
    public static double ExpectedMeanDistance(double density) => 0.5 / Math.Sqrt(density);

    /// <summary>Computes R, z and p for one field. Needs at least two points (two reference points with a guard region).</summary>
    /// <exception cref="ArgumentException">Too few points, or a periodic rule on a plain field.</exception>
    public static ClarkEvansResult Compute(ReadOnlySpan<Point2D> points, CaptureField field, ClarkEvansOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(field);
        options ??= new ClarkEvansOptions();
        if (points.Length < 2)
        {
            throw new ArgumentException($"the Clark–Evans ratio needs at least 2 points (got {points.Length})", nameof(points));
        }
        EdgeRule rule = field.Periodic ? EdgeRule.Periodic : options.EdgeRule;
        if (rule == EdgeRule.Periodic && !field.Periodic)
        {
            throw new ArgumentException("EdgeRule.Periodic needs a periodic field (CaptureField.PeriodicBox)");
        }
        double density = points.Length / ObservedArea(field);
        double guard = 0.0;
        if (rule == EdgeRule.GuardRegion)
        {
            guard = double.IsNaN(options.GuardWidth) ? 1.5 / Math.Sqrt(density) : options.GuardWidth;
            if (!double.IsFinite(guard) || guard < 0.0)
            {
                throw new ArgumentException($"guard width must be a finite number >= 0 (got {options.GuardWidth})");
            }
        }

        var distances = new double[points.Length];
        var neighbours = new int[points.Length];
        NearestNeighbours.Compute(points, field, distances, neighbours);
        double sum = 0.0;
        int n = 0;
        for (int i = 0; i < points.Length; i++)
        {
            if (rule == EdgeRule.GuardRegion && !IsReference(points[i], field, guard))
            {
                continue;
            }
            sum += distances[i];
            n++;
        }
        if (n < 2)
        {
            throw new ArgumentException(
                $"only {n} point(s) lie at least {guard:G4} from the edge; use a narrower guard or EdgeRule.None");
        }
        double mean = sum / n;
        double expected = ExpectedMeanDistance(density);
        double sigma = StandardErrorConstant / Math.Sqrt(n * density);
        double z = (mean - expected) / sigma;
        double p = 2.0 * (1.0 - Normal.CDF(0.0, 1.0, Math.Abs(z)));
        return new ClarkEvansResult(points.Length, n, density, mean, expected, mean / expected, sigma, z, p, rule, guard);
    }

    /// <summary>Field area minus the part of the excluded band inside it.</summary>
    public static double ObservedArea(CaptureField field)
    {
        ArgumentNullException.ThrowIfNull(field);
        double area = field.Area;
        if (field.Band is { } b)
        {
            double w = Math.Max(0.0, Math.Min(b.MaxX, field.MaxX) - Math.Max(b.MinX, field.MinX));
            double h = Math.Max(0.0, Math.Min(b.MaxY, field.MaxY) - Math.Max(b.MinY, field.MinY));
            area -= w * h;
        }
        return area;
    }

    private static bool IsReference(Point2D p, CaptureField field, double guard)
    {
        if (p.X - field.MinX < guard || field.MaxX - p.X < guard || p.Y - field.MinY < guard || field.MaxY - p.Y < guard)
        {
            return false;
        }
        return field.Band is not { } band || band.DistanceSquaredTo(p.X, p.Y) >= guard * guard;
    }
}
