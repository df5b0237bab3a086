using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class DiffusionLengthTests
{
    // COMMON PRACTICE, no source: a 5-minute growth at 500 °C corresponds to L ≈ 3 µm with c = 1,
    // i.e. D(500 °C) = (3e-4 cm)² / 300 s = 3e-10 cm²/s. Ea = 1 eV is our choice; D0 follows from it.
    private static readonly ArrheniusDiffusivity TradeExample = ArrheniusDiffusivity.FromReference(3e-10, 500 + 273.15, 1.0);

    [Fact]
    public void NominalLengthUm_FiveMinutesAt500C_IsThreeMicrometres()
    {
        Assert.Equal(3e-10, TradeExample.DiffusivityCmSqPerS(773.15), 3e-10 * 1e-13);
        Assert.Equal(3.0, DiffusionLength.NominalLengthUm(TradeExample, 500, 300, 1), 1e-12);
    }

    [Fact]
    public void EffectiveLength_ConstantFiveMinutesAt500C_IsThreeMicrometres()
    {
        var (t, r) = ThermalProfiles.Sample(0, 300, 0.1, _ => 500.0);
        var record = new ThermalRecord("substrate_tc", t, r);
        DiffusionLengthResult result = DiffusionLengthCalculator.Compute(record, TradeExample, new GrowthWindow(0, 300), new DiffusionLengthOptions());
        Assert.Equal(3.0, result.EffectiveLengthUm, 1e-11);
        Assert.Equal(500.0, result.EffectiveTemperatureC, 1e-9);
    }

    [Fact]
    public void EffectiveLength_CoolerShorterGrowth_ShrinksByArrheniusAndSquareRootFactors()
    {
        // DERIVED: L ∝ sqrt(t)·exp(−Ea/(2·kB·T)), so L(480 °C, 200 s) = 3 µm · sqrt(200/300) · exp(−Ea/(2kB)·(1/753.15 − 1/773.15)).
        var (t, r) = ThermalProfiles.Sample(0, 200, 0.1, _ => 480.0);
        var record = new ThermalRecord("substrate_tc", t, r);
        DiffusionLengthResult result = DiffusionLengthCalculator.Compute(record, TradeExample, new GrowthWindow(0, 200), new DiffusionLengthOptions());
        double arrhenius = Math.Exp(-1.0 / (2 * PhysicalConstants.BoltzmannEvPerK) * (1 / 753.15 - 1 / 773.15));
        double expected = 3.0 * Math.Sqrt(200.0 / 300.0) * arrhenius;
        Assert.Equal(expected, result.EffectiveLengthUm, expected * 1e-12);
        Assert.True(result.EffectiveLengthUm < 3.0);
    }

    [Fact]
    public void EffectiveTemperatureK_InvertsArrhenius()
    {
        var d = new ArrheniusDiffusivity(0.8, 1.7);
        double integral = d.DiffusivityCmSqPerS(900) * 1234;
        Assert.Equal(900.0, DiffusionLength.EffectiveTemperatureK(d, integral, 1234), 1e-9);
        Assert.True(double.IsNaN(DiffusionLength.EffectiveTemperatureK(d, 0, 1234)));
        Assert.True(double.IsNaN(DiffusionLength.EffectiveTemperatureK(d, integral, 0)));
    }

    [Theory]
    [InlineData(1.0, 873.15)]
    [InlineData(2.2, 900.0)]
    [InlineData(0.5, 700.0)]
    public void LogSensitivityPerK_MatchesNumericalDerivative(double eaEv, double temperatureK)
    {
        // DERIVED: d(ln L)/dT = Ea/(2·kB·T²) against a central difference of ln L over constant-T windows.
        var d = new ArrheniusDiffusivity(1e-2, eaEv);
        const double h = 1e-3;
        double lnPlus = Math.Log(DiffusionLength.LengthUm(d.DiffusivityCmSqPerS(temperatureK + h) * 600, 1));
        double lnMinus = Math.Log(DiffusionLength.LengthUm(d.DiffusivityCmSqPerS(temperatureK - h) * 600, 1));
        double numerical = (lnPlus - lnMinus) / (2 * h);
        double analytic = DiffusionLength.LogSensitivityPerK(eaEv, temperatureK);
        Assert.Equal(analytic, numerical, analytic * 1e-6);
    }

    [Fact]
    public void LogSensitivity_OneEvAt600C_MatchesChecksTable()
    {
        // DERIVED (CHECKS §8): d ln D/dT = 0.01522 1/K for Ea = 1 eV at 600 °C; +10 K multiplies D by 1.1624.
        var d = new ArrheniusDiffusivity(1, 1);
        Assert.Equal(0.01522, d.LogSensitivityPerK(873.15), 5e-6);
        Assert.Equal(0.01522 / 2, DiffusionLength.LogSensitivityPerK(1, 873.15), 5e-6);
        Assert.Equal(1.1624, d.DiffusivityCmSqPerS(883.15) / d.DiffusivityCmSqPerS(873.15), 5e-5);
    }

    [Fact]
    public void LengthUm_ConventionFactorFour_DoublesTheLength()
    {
        // COMMON PRACTICE: L = sqrt(4·D·t) (2-D mean-square displacement) is twice sqrt(D·t).
        Assert.Equal(2 * DiffusionLength.LengthUm(2e-9, 1), DiffusionLength.LengthUm(2e-9, 4), 1e-12);
        Assert.Equal(Math.Sqrt(2e-9) * 1e4, DiffusionLength.LengthUm(2e-9, 1), 1e-12);
    }

    [Fact]
    public void LengthChangeUm_ExcessIntegral_IsDifferenceOfLengths()
    {
        double total = 9e-8;
        double excess = 1e-8;
        Assert.Equal(3.0 - Math.Sqrt(8e-8) * 1e4, DiffusionLength.LengthChangeUm(total, excess, 1), 1e-12);
        Assert.True(DiffusionLength.LengthChangeUm(total, -excess, 1) < 0);
    }
}
