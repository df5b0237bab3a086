using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.PointPatterns;

// Source for every check here unless stated: Clark, P. J. & Evans, F. C. (1954) "Distance to nearest neighbor as
// a measure of spatial relationships in populations", Ecology 35, 445–453 (CONFIRMED (secondary), CHECKS.md §2).
public sealed class ClarkEvansTests
{
    private const int Patterns = 200;
    private const int PointsPerPattern = 1000;

    [Fact]
    public void Compute_PoissonInPeriodicBox_RatioIsOneWithinSamplingError()
    {
        // CONFIRMED (secondary): E[r] = 1/(2√λ) under CSR, so E[R] = 1. COMPUTED HERE (CHECKS.md §2): sd(R) =
        // 0.0172 for N = 1000 periodic; the formula's 0.5227/√N = 0.0165. Tolerance 4 standard errors of the mean.
        var field = CaptureField.PeriodicBox(1, 1);
        (double mean, double sd) = RatioStatistics(field, EdgeRule.Periodic);
        Assert.InRange(mean, 1.0 - (4 * 0.0172 / Math.Sqrt(Patterns)), 1.0 + (4 * 0.0172 / Math.Sqrt(Patterns)));
        Assert.InRange(sd, 0.014, 0.020);
    }

    [Fact]
    public void Compute_PoissonWithoutEdgeCorrection_RatioBiasedHighByAboutOnePercent()
    {
        // Edge bias without correction (CHECKS.md §2): Donnelly (1978) predicts 1.0133 for N = 1000 in a unit
        // square (constants FROM MEMORY); COMPUTED HERE 1.0127. This is why the default is a guard region.
        var field = CaptureField.Rectangle(1, 1);
        (double mean, _) = RatioStatistics(field, EdgeRule.None);
        double tolerance = 4 * 0.0172 / Math.Sqrt(Patterns);
        Assert.InRange(mean, 1.0130 - tolerance, 1.0130 + tolerance);
        Assert.True(mean > 1.0 + tolerance, $"uncorrected mean R {mean} should sit clearly above 1");
    }

    [Fact]
    public void Compute_PoissonWithGuardRegion_RatioIsOneWithinSamplingError()
    {
        // DERIVED: with a guard of 1.5/√λ a reference point's true nearest neighbour lies outside the field with
        // probability below exp(−2.25π) ≈ 0.09 %, so the mean is CSR's. About 82 % of points are references,
        // so the standard error grows by √(1/0.82).
        var field = CaptureField.Rectangle(1, 1);
        (double mean, _) = RatioStatistics(field, EdgeRule.GuardRegion);
        double tolerance = 4 * 0.0172 * Math.Sqrt(1 / 0.82) / Math.Sqrt(Patterns);
        Assert.InRange(mean, 1.0 - tolerance, 1.0 + tolerance);
    }

    [Fact]
    public void Compute_PoissonAtOnePerSquareMicrometre_MeanDistanceIsHalfMicrometre()
    {
        // CHECKS.md §2: λ = 1e8 cm⁻² = 1 µm⁻² gives r̄_E = 500 nm. σ of one pattern's mean = 0.26136/√(Nλ).
        var field = CaptureField.PeriodicBox(40, 40);
        double sum = 0;
        int count = 0;
        for (int seed = 0; seed < 100; seed++)
        {
            Point2D[] points = NucleationSites.Poisson(field, ArealDensity.PerSquareMicrometre(1e8), seed);
            sum += ClarkEvans.Compute(points, field).MeanDistance;
            count++;
        }
        double se = 0.26136 / Math.Sqrt(1600) / Math.Sqrt(count);
        Assert.Equal(0.5, ClarkEvans.ExpectedMeanDistance(1.0), 12);
        Assert.InRange(sum / count, 0.5 - (4 * se), 0.5 + (4 * se));
    }

    [Fact]
    public void Compute_Poisson_ZScoresAreRoughlyStandardNormal()
    {
        // z = (r̄_A − r̄_E)/σ, σ = 0.26136/√(Nλ): mean 0 and sd ≈ 1 (1.04 from the COMPUTED HERE sd above).
        var field = CaptureField.PeriodicBox(1, 1);
        var z = new double[Patterns];
        for (int seed = 0; seed < Patterns; seed++)
        {
            z[seed] = ClarkEvans.Compute(NucleationSites.Uniform(field, PointsPerPattern, 5000 + seed), field).Z;
        }
        double mean = z.Average();
        double sd = Math.Sqrt(z.Sum(v => (v - mean) * (v - mean)) / (z.Length - 1));
        Assert.InRange(mean, -4 * 1.04 / Math.Sqrt(Patterns), 4 * 1.04 / Math.Sqrt(Patterns));
        Assert.InRange(sd, 0.85, 1.25);
    }

    [Fact]
    public void StandardErrorConstant_IsTheCsrNearestNeighbourSpread()
    {
        // DERIVED (CHECKS.md §2): 0.26136 = √((4 − π)/(4π)) = 0.2613616.
        Assert.Equal(0.2613616, ClarkEvans.StandardErrorConstant, 7);
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Compute_SquareLattice_RatioIsTwo(bool periodic)
    {
        // DERIVED: NN distance a, λ = 1/a², r̄_E = a/2, so R = 2 exactly.
        const double a = 0.2;
        var field = periodic ? CaptureField.PeriodicBox(20 * a, 20 * a) : CaptureField.Rectangle(20 * a, 20 * a);
        var points = new List<Point2D>();
        for (int i = 0; i < 20; i++)
        {
            for (int j = 0; j < 20; j++)
            {
                points.Add(new Point2D((i + 0.5) * a, (j + 0.5) * a));
            }
        }
        ClarkEvansResult result = ClarkEvans.Compute(points.ToArray(), field);
        Assert.Equal(2.0, result.Ratio, 9);
        Assert.True(result.Z > 10);
    }

    [Fact]
    public void Compute_TriangularLattice_RatioIs2Point1491()
    {
        // DERIVED (CHECKS.md §2): R = 2·√(2/√3) = 2.14914 for a triangular lattice; the rdrr.io page for
        // compInd::clarkEvans gives "highest value of 2.15" (CONFIRMED (secondary)).
        const double a = 1.0;
        const int columns = 24, rows = 28; // even row count so the lattice closes on the torus
        double rowStep = a * Math.Sqrt(3) / 2;
        var field = CaptureField.PeriodicBox(columns * a, rows * rowStep);
        var points = new List<Point2D>();
        for (int r = 0; r < rows; r++)
        {
            for (int c = 0; c < columns; c++)
            {
                points.Add(new Point2D((c + (r % 2 == 0 ? 0.25 : 0.75)) * a, (r + 0.5) * rowStep));
            }
        }
        ClarkEvansResult result = ClarkEvans.Compute(points.ToArray(), field);
        Assert.Equal(2.0 * Math.Sqrt(2.0 / Math.Sqrt(3.0)), result.Ratio, 9);
        Assert.Equal(2.14914, result.Ratio, 4);
        Assert.Equal(ArealDensity.TriangularLattice(a), result.Density, 9);
    }

    [Fact]
    public void Compute_OnePoint_Throws()
    {
        Assert.Throws<ArgumentException>(() => ClarkEvans.Compute([new Point2D(1, 1)], CaptureField.Rectangle(2, 2)));
    }

    [Fact]
    public void Compute_PeriodicRuleOnPlainField_Throws()
    {
        var options = new ClarkEvansOptions { EdgeRule = EdgeRule.Periodic };
        Assert.Throws<ArgumentException>(() =>
            ClarkEvans.Compute([new Point2D(1, 1), new Point2D(1.5, 1)], CaptureField.Rectangle(2, 2), options));
    }

    [Fact]
    public void ObservedArea_BandInsideField_IsSubtracted()
    {
        // DERIVED: 100 × 100 minus a 100 × 10 strip.
        var field = CaptureField.Rectangle(100, 100, ExcludedBand.Horizontal(0, 100, 90, 100));
        Assert.Equal(9000, ClarkEvans.ObservedArea(field), 9);
    }

    private static (double Mean, double Sd) RatioStatistics(CaptureField field, EdgeRule rule)
    {
        var ratios = new double[Patterns];
        var options = new ClarkEvansOptions { EdgeRule = rule };
        for (int seed = 0; seed < Patterns; seed++)
        {
            Point2D[] points = NucleationSites.Uniform(field, PointsPerPattern, 1000 + seed);
            ratios[seed] = ClarkEvans.Compute(points, field, options).Ratio;
        }
        double mean = ratios.Average();
        double sd = Math.Sqrt(ratios.Sum(r => (r - mean) * (r - mean)) / (ratios.Length - 1));
        return (mean, sd);
    }
}
