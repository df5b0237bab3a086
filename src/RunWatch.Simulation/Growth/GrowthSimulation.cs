using MathNet.Numerics.Random;
using RunWatch.Core.Geometry;

namespace RunWatch.Simulation.Growth;

/// <summary>
/// Grows wires on a periodic substrate over a real thermal history with <see cref="AdatomCollector"/> (invented demo
/// truth). The history is run in slices; in each, every footprint is the wire's radius reached half-way through it
/// (collected so far plus half the previous slice's rate), so wires grow while they collect. Each wire has its own
/// seed radius and nucleation delay (<see cref="AdatomPhysics"/>). Seeded: the same inputs give the same wires.
/// </summary>
public static class GrowthSimulation
{
    /// <summary>Slices of the history (footprint updates).</summary>
    public const int Slices = 6;

    /// <summary>
    /// Grows the wires at <paramref name="sitesUm"/> in the periodic box <paramref name="widthUm"/> × <paramref name="heightUm"/>,
    /// launching <paramref name="launchedPerWire"/> adatoms per wire over the history (the catch's relative noise is
    /// about 1/√(caught per wire)).
    /// </summary>
    public static GrownWires Grow(ReadOnlySpan<Point2D> sitesUm, double widthUm, double heightUm, CaptureHistory history, AdatomPhysics physics,
        int launchedPerWire, int seed)
    {
        ArgumentNullException.ThrowIfNull(history);
        ArgumentNullException.ThrowIfNull(physics);
        ArgumentOutOfRangeException.ThrowIfLessThan(launchedPerWire, 1);
        int n = sitesUm.Length;
        var random = new Xoshiro256StarStar(seed, threadSafe: false);
        var seedRadii = new double[n];
        var nucleation = new double[n];
        for (int i = 0; i < n; i++)
        {
            seedRadii[i] = Math.Max(5, physics.SeedRadiusNm + (physics.SeedRadiusSdNm * Gaussian(random)));
            nucleation[i] = history.StartS - (physics.MeanNucleationDelayS * Math.Log(1 - random.NextDouble()));
        }
        // The largest radius any wire can reach: it collects its whole box share with no desorption, times 3 for luck.
        double largestNm = physics.RadiusNm(physics.SeedRadiusNm + (6 * physics.SeedRadiusSdNm), 3 * widthUm * heightUm / Math.Max(n, 1) * history.DurationS);
        var collector = new AdatomCollector(sitesUm, widthUm, heightUm, Math.Min(largestNm / 1000, 0.2));
        var caught = new long[n];
        var before = new long[n];
        var footprints = new double[n];
        var areaTime = new double[n];
        double perCount = widthUm * heightUm * history.DurationS / ((double)launchedPerWire * n);
        long launched = 0, desorbed = 0;
        double sliceS = history.DurationS / Slices;
        for (int s = 0; s < Slices; s++)
        {
            for (int i = 0; i < n; i++)
            {
                double lastSlice = (caught[i] - before[i]) * perCount;
                double ahead = s == 0 ? 0 : 0.5 * lastSlice;
                footprints[i] = Math.Min(physics.RadiusNm(seedRadii[i], (caught[i] * perCount) + ahead) / 1000, 0.2);
                before[i] = caught[i];
            }
            long count = (long)launchedPerWire * n / Slices;
            double from = history.StartS + (s * sliceS);
            desorbed += collector.Collect(footprints, nucleation, history, from, from + sliceS, count, unchecked(seed + 1 + s), caught);
            launched += count;
        }
        perCount = widthUm * heightUm * history.DurationS / launched;
        var radii = new double[n];
        long total = 0;
        for (int i = 0; i < n; i++)
        {
            areaTime[i] = caught[i] * perCount;
            radii[i] = physics.RadiusNm(seedRadii[i], areaTime[i]);
            total += caught[i];
        }
        return new GrownWires(sitesUm.ToArray(), radii, areaTime, seedRadii, nucleation, launched, total, desorbed);
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());
}
