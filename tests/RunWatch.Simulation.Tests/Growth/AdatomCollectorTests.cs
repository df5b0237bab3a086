using MathNet.Numerics;
using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Simulation.Growth;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Simulation.Tests.Growth;

/// <summary>The demo's adatom truth against physics it must obey (each check's source named beside it).</summary>
public sealed class AdatomCollectorTests(ITestOutputHelper output)
{
    /// <summary>A history held at one temperature for 100 s (10 Hz samples).</summary>
    private static CaptureHistory Held(AdatomPhysics physics, double temperatureC, double seconds = 100) => Stepped(physics, temperatureC, temperatureC, seconds);

    /// <summary>First half at <paramref name="firstC"/>, second half at <paramref name="secondC"/>.</summary>
    private static CaptureHistory Stepped(AdatomPhysics physics, double firstC, double secondC, double seconds)
    {
        int count = (int)(seconds * 10);
        var t = new double[count];
        var c = new double[count];
        for (int k = 0; k < count; k++)
        {
            t[k] = k * 0.1;
            c[k] = t[k] < seconds / 2 ? firstC : secondC;
        }
        return new CaptureHistory(t, c, physics);
    }

    /// <summary>Isolated disc sink: A = 2πRλ·K₁(R/λ)/K₀(R/λ) (DERIVED closed form; Bessel K from MathNet.Numerics), plus πR² landing on the footprint itself.</summary>
    private static double IsolatedCatchUm2(double radiusUm, double lambdaUm) =>
        (2 * Math.PI * radiusUm * lambdaUm * SpecialFunctions.BesselK1(radiusUm / lambdaUm) / SpecialFunctions.BesselK0(radiusUm / lambdaUm)) + (Math.PI * radiusUm * radiusUm);

    /// <summary>
    /// One wire alone in a 6 × 6 µm periodic box (images 6 µm ≈ 12 λ away, e^−12 of effect): the share of adatoms it
    /// catches × box area is the closed-form capture area. 3σ of the Poisson noise is about 2.5 %.
    /// </summary>
    [Theory]
    [InlineData(610, 0.04)]
    [InlineData(630, 0.025)]
    public void Collect_IsolatedWire_MatchesBesselClosedForm(double temperatureC, double footprintUm)
    {
        var physics = new AdatomPhysics();
        CaptureHistory history = Held(physics, temperatureC);
        var collector = new AdatomCollector([new Point2D(3.1, 2.9)], 6, 6, 0.1);
        var caught = new long[1];
        const long Launched = 1_000_000;

        long desorbed = collector.Collect([footprintUm], [0.0], history, history.StartS, history.EndS, Launched, 11, caught);

        double lambda = physics.CaptureLengthUm(temperatureC);
        double measured = caught[0] * 36.0 / Launched;
        double expected = IsolatedCatchUm2(footprintUm, lambda);
        output.WriteLine($"{temperatureC} °C: λ {lambda:F4} µm, caught {caught[0]} → {measured:F4} µm² vs closed form {expected:F4} µm² (ratio {measured / expected:F4})");
        Assert.Equal(Launched, caught[0] + desorbed);
        Assert.InRange(measured / expected, 0.975, 1.025);
    }

    /// <summary>
    /// A held excursion: half the history at 610 °C, half at 640 °C. The wire's catch is the time-average of the two
    /// closed forms (DERIVED: each adatom carries the λ of its landing time), so a history's ramps and excursions
    /// reach the truth as they happened.
    /// </summary>
    [Fact]
    public void Collect_TwoTemperatureHistory_CatchIsTimeAverageOfClosedForms()
    {
        var physics = new AdatomPhysics();
        CaptureHistory history = Stepped(physics, 610, 640, 100);
        var collector = new AdatomCollector([new Point2D(3.1, 2.9)], 6, 6, 0.1);
        var caught = new long[1];
        const long Launched = 1_000_000;

        collector.Collect([0.04], [0.0], history, history.StartS, history.EndS, Launched, 12, caught);

        double expected = 0.5 * (IsolatedCatchUm2(0.04, physics.CaptureLengthUm(610)) + IsolatedCatchUm2(0.04, physics.CaptureLengthUm(640)));
        double measured = caught[0] * 36.0 / Launched;
        output.WriteLine($"610/640 °C: {measured:F4} vs {expected:F4} µm² (610 alone {IsolatedCatchUm2(0.04, physics.CaptureLengthUm(610)):F4})");
        Assert.InRange(measured / expected, 0.975, 1.025);
    }

    /// <summary>
    /// Mass balance without desorption (λ of kilometres): every adatom is caught, and on a hexagonal lattice each wire
    /// catches its cell's share 1/N (symmetry, DERIVED) within Poisson noise (4σ).
    /// </summary>
    [Fact]
    public void Collect_HexagonalLatticeNoDesorption_AllCaughtEqualShares()
    {
        var physics = new AdatomPhysics(LifetimePrefactorS: 1e3);
        CaptureHistory history = Held(physics, 610, 10);
        const double a = 0.7, row = 0.6062;
        var sites = new List<Point2D>();
        for (int j = 0; j < 6; j++)
        {
            for (int i = 0; i < 6; i++)
            {
                sites.Add(new Point2D((i + (0.5 * (j % 2))) * a, j * row));
            }
        }
        var collector = new AdatomCollector(sites.ToArray(), 6 * a, 6 * row, 0.1);
        var caught = new long[sites.Count];
        const long Launched = 360_000;

        long desorbed = collector.Collect(Enumerable.Repeat(0.03, sites.Count).ToArray(), new double[sites.Count], history, history.StartS, history.EndS, Launched, 13, caught);

        double share = (double)Launched / sites.Count;
        output.WriteLine($"λ {physics.CaptureLengthUm(610):E2} µm: desorbed {desorbed}; catches {caught.Min()}–{caught.Max()} of {share:F0} expected");
        Assert.Equal(0, desorbed);
        Assert.Equal(Launched, caught.Sum());
        Assert.All(caught, c => Assert.InRange(c, share - (4 * Math.Sqrt(share)), share + (4 * Math.Sqrt(share))));
    }

    /// <summary>
    /// A crowded random field (2 wires per µm², λ ≈ 0.5 µm) against the project's grid solver on the same geometry
    /// (Core's <see cref="ScreenedDiffusionSolver"/>, checked itself against Bessel, SciPy and mass balance): the
    /// truth is built without it, so agreement checks both. Total catch within 1 %, each wire within 5σ of its noise
    /// plus the grid's 1 %.
    /// </summary>
    [Fact]
    public void Collect_CrowdedField_AgreesWithIndependentGridSolution()
    {
        var physics = new AdatomPhysics();
        CaptureHistory history = Held(physics, 610, 10);
        var box = CaptureField.PeriodicBox(5, 4);
        Point2D[] sites = RunWatch.Core.PointPatterns.NucleationSites.RandomSequentialAdsorption(box, 2.0, 0.25, 21).Points;
        double[] footprints = Enumerable.Repeat(0.04, sites.Length).ToArray();
        var collector = new AdatomCollector(sites, 5, 4, 0.1);
        var caught = new long[sites.Length];
        const long Launched = 1_000_000;

        collector.Collect(footprints, new double[sites.Length], history, history.StartS, history.EndS, Launched, 14, caught);
        SinkCurrents grid = new ScreenedDiffusionSolver(SinkGrid.Rasterise(sites, footprints, box, 0.01)).Solve(physics.CaptureLengthUm(610), BorderCondition.Periodic);

        double footprint = Math.PI * 0.04 * 0.04;
        double mcTotal = 0, gridTotal = 0;
        for (int i = 0; i < sites.Length; i++)
        {
            double mc = caught[i] * 20.0 / Launched;
            double expected = grid.CaptureAreas[i] + footprint;
            double sigma = expected * ((1 / Math.Sqrt(caught[i] + 1.0)) + 0.002);
            Assert.True(Math.Abs(mc - expected) <= (5 * sigma) + (0.01 * expected), $"wire {i}: truth {mc:F4}, grid {expected:F4} µm²");
            mcTotal += mc;
            gridTotal += expected;
        }
        output.WriteLine($"{sites.Length} wires: truth {mcTotal:F4} µm², grid {gridTotal:F4} µm² (ratio {mcTotal / gridTotal:F4})");
        Assert.InRange(mcTotal / gridTotal, 0.99, 1.01);
    }
}
