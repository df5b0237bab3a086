using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.PointPatterns;

public sealed class WignerSurmiseFitTests
{
    [Theory]
    [InlineData(1.0, 1)]
    [InlineData(2.0, 2)]
    [InlineData(3.0, 3)]
    [InlineData(5.0, 4)]
    [InlineData(8.0, 5)]
    public void Fit_SamplesFromKnownBeta_RecoversItWithinTheInterval(double beta, int seed)
    {
        // Recovery test (CHECKS.md §4): draws from P_β, multiplied by an arbitrary area unit (the fit normalises by
        // the sample mean), give back β inside the 95 % profile-likelihood interval; the moment estimate agrees
        // within 10 %.
        double[] areas = Draws(beta, 4000, seed, scale: 123.4);
        WignerFitResult fit = WignerSurmiseFit.Fit(areas);
        Assert.InRange(beta, fit.BetaLower, fit.BetaUpper);
        Assert.True(fit.BetaUpper - fit.BetaLower < 0.25 * beta + 0.3, $"interval [{fit.BetaLower}, {fit.BetaUpper}] too wide");
        Assert.InRange(fit.MomentBeta, 0.9 * beta - 0.1, 1.1 * beta + 0.1);
        Assert.False(fit.AtSearchBound);
        Assert.Equal(4000, fit.UsedCount);
    }

    [Theory]
    [InlineData(2.0, 11)]
    [InlineData(5.0, 12)]
    public void Fit_WindowHalfToTwo_RecoversBetaFromTruncatedLikelihood(double beta, int seed)
    {
        // CHECKS.md §4 suggests fitting on 0.5 < s < 2: the truncated likelihood must still recover β.
        double[] areas = Draws(beta, 6000, seed, scale: 1.0);
        WignerFitResult fit = WignerSurmiseFit.Fit(areas, new WignerFitOptions { MinS = 0.5, MaxS = 2.0 });
        Assert.InRange(beta, fit.BetaLower, fit.BetaUpper);
        Assert.True(fit.UsedCount < 6000);
    }

    [Fact]
    public void Fit_ReportsTheMappingUsed()
    {
        double[] areas = Draws(4.0, 3000, 7, scale: 1.0);
        WignerFitResult byReview = WignerSurmiseFit.Fit(areas);
        WignerFitResult byOriginal = WignerSurmiseFit.Fit(areas, new WignerFitOptions { Mapping = CriticalNucleusMapping.PimpinelliEinstein2007 });
        Assert.Equal(byReview.Beta - 2.0, byReview.CriticalNucleusSize, 12);
        Assert.Equal(byOriginal.Beta - 1.0, byOriginal.CriticalNucleusSize, 12);
        Assert.Contains("β − 2", byReview.MappingDescription, StringComparison.Ordinal);
        Assert.Contains("2014", byReview.MappingDescription, StringComparison.Ordinal);
        Assert.Contains("2007", byOriginal.MappingDescription, StringComparison.Ordinal);
    }

    [Fact]
    public void MomentBeta_VarianceOfBetaTwo_GivesTwo()
    {
        // DERIVED: Var = 3/(2·4/π) − 1 = 3π/8 − 1 for β = 2.
        Assert.Equal(2.0, WignerSurmiseFit.MomentBeta((3 * Math.PI / 8) - 1), 8);
    }

    [Fact]
    public void MomentBeta_VarianceAboveBetaZero_IsNaN()
    {
        // DERIVED: β = 0 gives Var = π/2 − 1 = 0.571, the largest in the default range.
        Assert.True(double.IsNaN(WignerSurmiseFit.MomentBeta(0.9)));
    }

    [Fact]
    public void Fit_NonPositiveArea_Throws()
    {
        var areas = Enumerable.Repeat(1.0, 20).ToArray();
        areas[3] = 0;
        var ex = Assert.Throws<ArgumentException>(() => WignerSurmiseFit.Fit(areas));
        Assert.Contains("area 3", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_TooFewAreas_Throws()
    {
        Assert.Throws<ArgumentException>(() => WignerSurmiseFit.Fit([1.0, 2.0, 3.0]));
    }

    private static double[] Draws(double beta, int n, int seed, double scale)
    {
        var s = new double[n];
        WignerSurmise.Sample(NucleationSites.CreateRandom(seed), beta, s);
        for (int i = 0; i < n; i++)
        {
            s[i] *= scale;
        }
        return s;
    }
}
