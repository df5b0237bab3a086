using RunWatch.Core.ControlCharts;
using Xunit;

namespace RunWatch.Core.Tests.ControlCharts;

/// <summary>Individuals-chart limits: a worked example, the handbook constant, and the estimator on simulated normal data.</summary>
public sealed class IndividualsLimitsTests
{
    [Fact]
    public void FromBaseline_WorkedExample_CentreMeanAndSigmaFromMovingRange()
    {
        // Values 10, 12, 11, 13, 14: mean 12; moving ranges 2, 1, 2, 1 → MR̄ = 1.5; σ̂ = 1.5 / (2/√π) (DERIVED by hand).
        var limits = IndividualsLimits.FromBaseline([10, 12, 11, 13, 14])!;
        Assert.Equal(5, limits.BaselineCount);
        Assert.Equal(12, limits.Centre, 12);
        double sigma = 1.5 * Math.Sqrt(Math.PI) / 2;
        Assert.Equal(sigma, limits.Sigma, 12);
        Assert.Equal(12 + (3 * sigma), limits.Upper, 12);
        Assert.Equal(12 - (3 * sigma), limits.Lower, 12);
    }

    [Fact]
    public void D2_MatchesHandbookConstant()
    {
        // NIST/SEMATECH e-Handbook 6.3.2.2 divides MR̄ by 1.128 (FROM MEMORY).
        Assert.Equal(1.128, IndividualsLimits.D2, 3);
    }

    [Fact]
    public void FromBaseline_NormalData_SigmaEstimateUnbiased()
    {
        // Independent normal draws (Box–Muller, seeded) with σ = 2.5: MR̄/d₂ must recover σ (standard error ≈ 0.4 % at n = 40 000).
        var random = new Random(20261205);
        var values = new double[40_000];
        for (int i = 0; i < values.Length; i++)
        {
            double u1 = 1 - random.NextDouble();
            double u2 = random.NextDouble();
            values[i] = 50 + (2.5 * Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2));
        }
        var limits = IndividualsLimits.FromBaseline(values)!;
        Assert.InRange(limits.Sigma, 2.5 * 0.985, 2.5 * 1.015);
        Assert.InRange(limits.Centre, 49.95, 50.05);
    }

    [Fact]
    public void FromBaseline_TooFewOrFlatOrNaN_NullOrSkipped()
    {
        Assert.Null(IndividualsLimits.FromBaseline([3.0]));
        Assert.Null(IndividualsLimits.FromBaseline([3.0, 3.0, 3.0]));
        // NaN is skipped: the moving range joins the finite neighbours.
        var limits = IndividualsLimits.FromBaseline([1.0, double.NaN, 3.0])!;
        Assert.Equal(2, limits.BaselineCount);
        Assert.Equal(2 / IndividualsLimits.D2, limits.Sigma, 12);
    }
}
