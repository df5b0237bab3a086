using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;
using RunWatch.Core.Geometry;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Seeded, reproducible simulated nucleation sites in a field: Poisson (complete spatial randomness), a fixed
/// number of uniform sites, and hard-core patterns (random sequential adsorption; Matérn type II thinning).
/// Sites cover the whole rectangle (an excluded band hides wires, it does not stop nucleation). In a periodic
/// field distances wrap around. The same seed gives the same sites on every machine (xoshiro256** from
/// MathNet.Numerics, not <see cref="System.Random"/>, whose seeded sequence is not a documented contract).
/// </summary>
public static class NucleationSites
{
    private const int MaxGridCells = 4_000_000;

    /// <summary>A random generator for <paramref name="seed"/>, the one all seed overloads use.</summary>
    public static Random CreateRandom(int seed) => new Xoshiro256StarStar(seed, threadSafe: false);

    /// <summary>Poisson point process: the count is Poisson(density·area), the sites uniform.</summary>
    /// <param name="field">Where to place the sites.</param>
    /// <param name="density">Sites per unit² of the field's unit (e.g. µm⁻²).</param>
    /// <param name="seed">Seed; the same seed gives the same sites.</param>
    public static Point2D[] Poisson(CaptureField field, double density, int seed) => Poisson(field, density, CreateRandom(seed));

    /// <inheritdoc cref="Poisson(CaptureField, double, int)"/>
    public static Point2D[] Poisson(CaptureField field, double density, Random random)
    {
        ArgumentNullException.ThrowIfNull(field);
        ArgumentNullException.ThrowIfNull(random);
        double mean = CheckedMeanCount(field, density);
        int count = mean == 0.0 ? 0 : MathNet.Numerics.Distributions.Poisson.Sample(random, mean);
        return Uniform(field, count, random);
    }

    /// <summary>Exactly <paramref name="count"/> independent uniform sites (binomial process).</summary>
    public static Point2D[] Uniform(CaptureField field, int count, int seed) => Uniform(field, count, CreateRandom(seed));

    /// <inheritdoc cref="Uniform(CaptureField, int, int)"/>
    public static Point2D[] Uniform(CaptureField field, int count, Random random)
    {
        ArgumentNullException.ThrowIfNull(field);
        ArgumentNullException.ThrowIfNull(random);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        var points = new Point2D[count];
        for (int i = 0; i < count; i++)
        {
            points[i] = RandomSite(field, random);
        }
        return points;
    }

    /// <summary>
    /// Random sequential adsorption: uniform candidates, each accepted only if no accepted site lies closer than
    /// <paramref name="minDistance"/>, until density·area sites are placed or the attempt budget is spent.
    /// </summary>
    /// <param name="field">Where to place the sites.</param>
    /// <param name="density">Target sites per unit².</param>
    /// <param name="minDistance">Hard-core distance d (same unit as the field).</param>
    /// <param name="seed">Seed.</param>
    /// <param name="attemptsPerSite">Budget: candidates drawn per requested site before giving up.</param>
    public static HardCorePattern RandomSequentialAdsorption(
        CaptureField field, double density, double minDistance, int seed, int attemptsPerSite = 1000)
    {
        ArgumentNullException.ThrowIfNull(field);
        double mean = CheckedMeanCount(field, density);
        CheckDistance(minDistance);
        ArgumentOutOfRangeException.ThrowIfLessThan(attemptsPerSite, 1);
        Random random = CreateRandom(seed);
        int target = (int)Math.Round(mean);
        var index = new HardCoreIndex(field, minDistance, target, MaxGridCells);
        var accepted = new List<Point2D>(target);
        long budget = (long)attemptsPerSite * Math.Max(1, target);
        long attempts = 0;
        while (accepted.Count < target && attempts < budget)
        {
            attempts++;
            Point2D candidate = RandomSite(field, random);
            if (!index.HasNeighbourCloserThan(candidate, minDistance, accepted, -1))
            {
                index.Add(candidate, accepted.Count);
                accepted.Add(candidate);
            }
        }
        return new HardCorePattern(accepted.ToArray(), target, attempts, accepted.Count == target);
    }

    /// <summary>
    /// Matérn type II hard-core process: Poisson parents of density <paramref name="parentDensity"/>, each with a
    /// uniform mark; a parent survives if no other parent within <paramref name="minDistance"/> has a smaller mark.
    /// Surviving density (periodic field) λ = (1 − exp(−λp·π·d²)) / (π·d²) (Matérn 1960; FROM MEMORY).
    /// </summary>
    public static Point2D[] MaternHardCore(CaptureField field, double parentDensity, double minDistance, int seed)
    {
        ArgumentNullException.ThrowIfNull(field);
        CheckDistance(minDistance);
        Random random = CreateRandom(seed);
        Point2D[] parents = Poisson(field, parentDensity, random);
        var marks = new double[parents.Length];
        for (int i = 0; i < marks.Length; i++)
        {
            marks[i] = random.NextDouble();
        }
        var index = new HardCoreIndex(field, minDistance, parents.Length, MaxGridCells);
        var all = new List<Point2D>(parents);
        for (int i = 0; i < parents.Length; i++)
        {
            index.Add(parents[i], i);
        }
        var kept = new List<Point2D>();
        for (int i = 0; i < parents.Length; i++)
        {
            if (!index.HasSmallerMarkWithin(parents[i], i, minDistance, all, marks))
            {
                kept.Add(parents[i]);
            }
        }
        return kept.ToArray();
    }

    private static Point2D RandomSite(CaptureField field, Random random)
    {
        double x = field.MinX + (random.NextDouble() * field.Width);
        double y = field.MinY + (random.NextDouble() * field.Height);
        return new Point2D(x, y);
    }

    private static double CheckedMeanCount(CaptureField field, double density)
    {
        if (!double.IsFinite(density) || density < 0.0)
        {
            throw new ArgumentException($"density must be a finite number >= 0 (got {density})", nameof(density));
        }
        double mean = density * field.Area;
        if (mean > 50_000_000)
        {
            throw new ArgumentException($"density × area = {mean:G4} sites is more than this simulation allows (5e7)", nameof(density));
        }
        return mean;
    }

    private static void CheckDistance(double minDistance)
    {
        if (!double.IsFinite(minDistance) || minDistance <= 0.0)
        {
            throw new ArgumentException($"minimum distance must be a finite number > 0 (got {minDistance})", nameof(minDistance));
        }
    }
}
