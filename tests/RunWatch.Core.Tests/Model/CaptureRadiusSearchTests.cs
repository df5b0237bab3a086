using RunWatch.Core.Model;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class CaptureRadiusSearchTests
{
    /// <summary>
    /// Each wire's cell is stood in for by a disc of the cell's area (radius ρ), so its capture area at L is
    /// π·min(ρ, L)² and Â = min(1, ρ²/L²) (DERIVED). Radii follow the model at the true L: the search must find it.
    /// </summary>
    private static (double[] Rho, CaptureAreaEvaluator Evaluator) Wafer(int wires, int seed)
    {
        var random = new Random(seed);
        var rho = new double[wires];
        for (int i = 0; i < wires; i++)
        {
            rho[i] = 150 + (500 * random.NextDouble());
        }
        void Evaluate(double l, Span<double> areas)
        {
            for (int i = 0; i < rho.Length; i++)
            {
                areas[i] = Math.Min(1, rho[i] * rho[i] / (l * l));
            }
        }
        return (rho, Evaluate);
    }

    [Theory]
    [InlineData(RadiusModelKind.Linear, 300.0)]
    [InlineData(RadiusModelKind.Linear, 480.0)]
    [InlineData(RadiusModelKind.PowerLaw, 400.0)]
    public void Find_RadiiGeneratedAtKnownL_RecoversL(RadiusModelKind kind, double trueL)
    {
        (double[] rho, CaptureAreaEvaluator evaluator) = Wafer(150, 3);
        var noise = new Random(9);
        double[] radii = rho.Select(p =>
        {
            double a = Math.Min(1, p * p / (trueL * trueL));
            double clean = kind == RadiusModelKind.Linear ? 15 + (45 * a) : 60 * Math.Sqrt(a);
            return clean + (0.2 * (noise.NextDouble() - 0.5));
        }).ToArray();

        CaptureRadiusFit best = CaptureRadiusSearch.Find(radii, evaluator, kind, 50, 5000);

        Assert.InRange(best.CaptureRadiusNm, trueL * 0.98, trueL * 1.02);
        Assert.False(best.AtSearchEdge);
        Assert.True(best.Fit.RSquared > 0.999);
        // The returned optimum beats every scanned point (up to float noise).
        Assert.All(best.Scan, p => Assert.True(double.IsNaN(p.RSquared) || p.RSquared <= best.Fit.RSquared + 1e-12));
    }

    [Fact]
    public void Find_WiresExcludedAtSomeL_UsesOnlyFiniteAreas()
    {
        (double[] rho, CaptureAreaEvaluator inner) = Wafer(80, 4);
        double[] radii = rho.Select(p => 10 + (50 * Math.Min(1, p * p / (350.0 * 350.0)))).ToArray();
        // Wire 0 is in the guard zone at every L.
        void Evaluator(double l, Span<double> areas)
        {
            inner(l, areas);
            areas[0] = double.NaN;
        }
        CaptureRadiusFit best = CaptureRadiusSearch.Find(radii, Evaluator, RadiusModelKind.Linear, 50, 5000);
        Assert.Equal(79, best.Fit.Count);
        Assert.InRange(best.CaptureRadiusNm, 343, 357);
    }

    /// <summary>
    /// At small L every zone is (nearly) a full disc: the power-law fit has no slope to find (singular Jacobian) and
    /// such L carry no information; the search must skip them, not fail the wafer.
    /// </summary>
    [Fact]
    public void Find_PowerLawWhereZonesAreNearlyAllFullDiscs_SkipsThoseL()
    {
        (double[] rho, CaptureAreaEvaluator inner) = Wafer(120, 5);
        double[] radii = rho.Select(p => 60 * Math.Sqrt(Math.Min(1, p * p / (400.0 * 400.0)))).ToArray();
        void Evaluator(double l, Span<double> areas)
        {
            inner(l, areas);
            if (l < 150)
            {
                areas[0] = 1 - 1e-15;
            }
        }

        CaptureRadiusFit best = CaptureRadiusSearch.Find(radii, Evaluator, RadiusModelKind.PowerLaw, 50, 5000);

        Assert.InRange(best.CaptureRadiusNm, 390, 410);
    }

    [Fact]
    public void Find_BadRange_Throws()
    {
        (_, CaptureAreaEvaluator evaluator) = Wafer(10, 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => CaptureRadiusSearch.Find(new double[10], evaluator, RadiusModelKind.Linear, 100, 50));
    }

    [Fact]
    public void Find_NoUsableWires_ThrowsClearError()
    {
        static void AllExcluded(double l, Span<double> areas) => areas.Fill(double.NaN);
        var ex = Assert.Throws<InvalidOperationException>(() => CaptureRadiusSearch.Find(new double[20], AllExcluded, RadiusModelKind.Linear, 10, 1000));
        Assert.Contains("usable wires", ex.Message, StringComparison.Ordinal);
    }
}
