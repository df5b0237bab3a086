using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;
using RunWatch.Reports.Model;
using Xunit;

namespace RunWatch.Reports.Tests.Model;

public sealed class ThermalSummariesTests
{
    [Fact]
    public void From_DiffusionLengthResult_ConvertsUnitsAndExcursionEffect()
    {
        var diffusivity = new ArrheniusDiffusivity(0.5, 1.2);
        var result = new DiffusionLengthResult
        {
            ConventionFactor = 4,
            Diffusivity = diffusivity,
            Window = new GrowthWindow(100, 1900),
            IntegralCmSq = 1e-9,
            CoveredS = 1782,
            CoveragePercent = 99,
            Gaps = [],
            MaxGapS = 5,
            EffectiveLengthUm = 0.6325,
            EffectiveTemperatureC = 611.5,
            LogSensitivityPerK = 0.008,
            NominalLengthUm = 0.61,
        };
        var excursion = new ExcursionSummary(500, 620, 14, 560, 624, ExcursionSeverity.Alarm, 1e-10, true);

        ThermalSummary summary = ThermalSummaries.From(result, [0, 1, 2], [600, 601, 602], [excursion], 610, "linear interpolation");

        Assert.Equal(632.5, summary.EffectiveLengthNm, 9);
        Assert.Equal(610, summary.NominalLengthNm, 9);
        Assert.Equal(0.99, summary.CoverageFraction, 12);
        Assert.Equal((100.0, 1900.0), (summary.GrowthWindowStartS, summary.GrowthWindowEndS));
        // DERIVED: ΔL/L = (√(c·I) − √(c·(I − ΔI)))/L_eff with I = 1e-9 cm², ΔI = 1e-10 cm², c = 4, via the thermal room's helper.
        double expected = excursion.LengthChangeUm(1e-9, 4) / 0.6325;
        ExcursionRow row = Assert.Single(summary.Excursions);
        Assert.Equal(expected, row.RelativeLChange, 12);
        Assert.True(row.RelativeLChange > 0);
        Assert.Equal("over-temperature (alarm)", row.Description);
    }
}
