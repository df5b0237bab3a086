using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class DiffusionLengthCalculatorTests
{
    private static readonly ArrheniusDiffusivity Process = new(2e-3, 1.3);

    [Fact]
    public void Compute_IsothermalWindow_EqualsClosedForm()
    {
        // DERIVED: constant T over t gives L_eff = sqrt(c·D(T)·t) and T_eff = T.
        var (t, r) = ThermalProfiles.SampleIrregular(-50, 1900, 0.05, 1.5, seed: 11, _ => 615.0);
        var record = new ThermalRecord("substrate_tc", t, r);
        var options = new DiffusionLengthOptions { ConventionFactor = 4 };
        DiffusionLengthResult result = DiffusionLengthCalculator.Compute(record, Process, new GrowthWindow(0, 1800), options, plan: new GrowthPlan(615, 1800));
        double expected = Math.Sqrt(4 * Process.DiffusivityCmSqPerS(888.15) * 1800) * 1e4;
        Assert.True(Math.Abs(result.EffectiveLengthUm / expected - 1) < 1e-12, $"{result.EffectiveLengthUm} vs {expected}");
        Assert.True(Math.Abs(result.EffectiveTemperatureC - 615) < 1e-12 * 888.15, $"{result.EffectiveTemperatureC}");
        Assert.Equal(expected, result.NominalLengthUm!.Value, expected * 1e-12);
        Assert.Equal(4, result.ConventionFactor);
        Assert.True(result.IsComplete);
        Assert.Equal(100.0, result.CoveragePercent, 1e-9);
        Assert.Equal(Process.LogSensitivityPerK(888.15) / 2, result.LogSensitivityPerK, 1e-12);
    }

    [Fact]
    public void Compute_Lifetime_GivesSqrtOfDTimesTau()
    {
        // DERIVED: isothermal λ = sqrt(c·D(T)·τ(T)), τ = τ0·exp(E_d/(kB·T)).
        var (t, r) = ThermalProfiles.Sample(0, 600, 1, _ => 600.0);
        var lifetime = new LifetimeModel(1e-13, 2.1);
        DiffusionLengthResult result = DiffusionLengthCalculator.Compute(new ThermalRecord("tc", t, r), Process, new GrowthWindow(0, 600), new DiffusionLengthOptions(), lifetime: lifetime);
        double expected = Math.Sqrt(Process.DiffusivityCmSqPerS(873.15) * lifetime.LifetimeS(873.15)) * 1e4;
        Assert.Equal(expected, result.LifetimeLimitedLengthUm!.Value, expected * 1e-11);
    }

    [Fact]
    public void Compute_GapInWindow_MarksIncompleteAndUsesCoveredTime()
    {
        double[] t = [0, 1, 2, 100, 101, 102];
        double[] r = [600, 600, 600, 600, 600, 600];
        DiffusionLengthResult result = DiffusionLengthCalculator.Compute(new ThermalRecord("tc", t, r), Process, new GrowthWindow(0, 102), new DiffusionLengthOptions());
        Assert.False(result.IsComplete);
        Assert.Equal(new RecordGap(2, 100), Assert.Single(result.Gaps));
        Assert.Equal(4.0, result.CoveredS, 1e-12);
        Assert.Equal(600.0, result.EffectiveTemperatureC, 1e-9);
    }

    [Fact]
    public void Compute_InvalidInput_Throws()
    {
        var record = new ThermalRecord("tc", [0.0, 1.0], [600.0, 600.0]);
        Assert.Throws<ArgumentException>(() => DiffusionLengthCalculator.Compute(record, Process, new GrowthWindow(10, 0), new DiffusionLengthOptions()));
        Assert.Throws<ArgumentException>(() => DiffusionLengthCalculator.Compute(record, new ArrheniusDiffusivity(-1, 1), new GrowthWindow(0, 1), new DiffusionLengthOptions()));
        Assert.Throws<ArgumentException>(() => DiffusionLengthCalculator.Compute(record, Process, new GrowthWindow(0, 1), new DiffusionLengthOptions { ConventionFactor = 0 }));
    }
}
