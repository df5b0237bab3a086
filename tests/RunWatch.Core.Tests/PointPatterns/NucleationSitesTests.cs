using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.PointPatterns;

public sealed class NucleationSitesTests
{
    [Fact]
    public void Poisson_SameSeed_GivesSameSites()
    {
        var field = CaptureField.Rectangle(30, 20);
        Assert.Equal(NucleationSites.Poisson(field, 2.0, 42), NucleationSites.Poisson(field, 2.0, 42));
        Assert.NotEqual(NucleationSites.Poisson(field, 2.0, 42), NucleationSites.Poisson(field, 2.0, 43));
    }

    [Fact]
    public void Poisson_Counts_HaveMeanAndVarianceLambdaA()
    {
        // DERIVED: the count of a Poisson process in area A is Poisson(λA): mean = variance = λA (here 200).
        var field = CaptureField.Rectangle(10, 10);
        var counts = Enumerable.Range(0, 400).Select(seed => (double)NucleationSites.Poisson(field, 2.0, seed).Length).ToArray();
        double mean = counts.Average();
        double variance = counts.Sum(c => (c - mean) * (c - mean)) / (counts.Length - 1);
        Assert.InRange(mean, 200 - (4 * Math.Sqrt(200.0 / 400)), 200 + (4 * Math.Sqrt(200.0 / 400)));
        Assert.InRange(variance, 200 * 0.7, 200 * 1.3);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void RandomSequentialAdsorption_BelowJamming_ReachesTargetAndKeepsMinimumDistance(bool periodic)
    {
        // DERIVED: 0.3/d² is well below the RSA jamming density ≈ 0.547·4/(π d²) = 0.70/d² (Feder 1980, FROM MEMORY).
        const double d = 1.0;
        var field = periodic ? CaptureField.PeriodicBox(40, 30) : CaptureField.Rectangle(40, 30);
        HardCorePattern pattern = NucleationSites.RandomSequentialAdsorption(field, 0.3, d, 9);
        Assert.True(pattern.ReachedTarget);
        Assert.Equal(360, pattern.Points.Length);
        double[] nn = NearestNeighbours.Distances(pattern.Points, field);
        Assert.True(nn.Min() >= d, $"closest pair {nn.Min()} < {d}");
    }

    [Fact]
    public void RandomSequentialAdsorption_AboveJamming_StopsAndSaysSo()
    {
        HardCorePattern pattern = NucleationSites.RandomSequentialAdsorption(CaptureField.Rectangle(10, 10), 1.2, 1.0, 3, attemptsPerSite: 50);
        Assert.False(pattern.ReachedTarget);
        Assert.True(pattern.Points.Length < pattern.RequestedCount);
    }

    [Fact]
    public void MaternHardCore_PeriodicBox_MatchesRetentionFormula()
    {
        // Matérn type II retention λ = (1 − exp(−λp π d²))/(π d²) (Matérn 1960; FROM MEMORY; DERIVED from the mark
        // rule: a parent survives with probability (1 − e^{−μ})/μ, μ = λp π d²). Tolerance 4 σ of a Poisson-like count.
        const double parent = 2.0, d = 0.6;
        var field = CaptureField.PeriodicBox(60, 60);
        double expected = (1 - Math.Exp(-parent * Math.PI * d * d)) / (Math.PI * d * d) * field.Area;
        double total = 0;
        for (int seed = 0; seed < 10; seed++)
        {
            Point2D[] points = NucleationSites.MaternHardCore(field, parent, d, seed);
            total += points.Length;
            Assert.True(NearestNeighbours.Distances(points, field).Min() >= d);
        }
        double mean = total / 10;
        Assert.InRange(mean, expected - (4 * Math.Sqrt(expected / 10)), expected + (4 * Math.Sqrt(expected / 10)));
    }

    [Theory]
    [InlineData(-1.0)]
    [InlineData(double.NaN)]
    public void Poisson_BadDensity_Throws(double density)
    {
        Assert.Throws<ArgumentException>(() => NucleationSites.Poisson(CaptureField.Rectangle(1, 1), density, 1));
    }
}
