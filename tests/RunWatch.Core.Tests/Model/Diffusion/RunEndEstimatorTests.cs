using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Model.Diffusion;

public sealed class RunEndEstimatorTests
{
    private static DiffusionRadiusModel Model(double lambdaAt610, double activation) =>
        new(CaptureLengthLaw.Through(lambdaAt610, PhysicalConstants.CelsiusToKelvin(610), activation).Lambda0SquaredUm2, activation, 2.5, 400,
            PhysicalConstants.CelsiusToKelvin(610), [], 590, 630, 1200, 2400, 1.5);

    private static ThermalRecord Record(double setpointC, int seconds, double excursionK)
    {
        double[] t = Enumerable.Range(0, seconds + 1).Select(i => (double)i).ToArray();
        double[] c = t.Select(x => setpointC + (x is >= 600 and <= 780 ? excursionK : 0)).ToArray();
        return new ThermalRecord("tc", t, c);
    }

    /// <summary>
    /// With λ far above the wire spacing almost nothing desorbs, so the mean collection per wire is the area per wire
    /// less its footprint (DERIVED: mass balance on the periodic field): mean r² = r₀² + κ·t·(1/ρ − πr_f²) within 1 %.
    /// </summary>
    [Fact]
    public void Estimate_LambdaFarAboveSpacing_MeanRadiusFollowsMassBalance()
    {
        DiffusionRadiusModel model = Model(20, 0);
        const double density = 2.0;

        RunEndEstimate e = RunEndEstimator.Estimate(model, Record(610, 1800, 0), TemperatureCalibration.Identity, new GrowthWindow(0, 1800), 610, [], density, 5, fieldUm: 8);

        double footprint = GrowthFootprint.FootprintUm(e.MeanRadiusNm);
        double expected = Math.Sqrt(400 + (2.5 * 1800 * ((1 / density) - (Math.PI * footprint * footprint))));
        Assert.InRange(e.MeanRadiusNm / expected, 0.98, 1.01);
        Assert.Equal(20, e.LambdaAtSetpointUm, 9);
        Assert.Equal(20, e.LambdaEffUm, 4);
    }

    /// <summary>An excursion's reported effect equals the estimate with it minus the estimate of the same run held at the setpoint.</summary>
    [Fact]
    public void Estimate_HotExcursionWithNegativeActivation_ThinsWiresByTheDifferenceOfTwoEstimates()
    {
        DiffusionRadiusModel model = Model(0.5, -1.2);
        var window = new GrowthWindow(0, 1800);

        RunEndEstimate with = RunEndEstimator.Estimate(model, Record(600, 1800, 25), TemperatureCalibration.Identity, window, 600, [new GrowthWindow(599.5, 780.5)], 1.5, 9, fieldUm: 8);
        RunEndEstimate without = RunEndEstimator.Estimate(model, Record(600, 1800, 0), TemperatureCalibration.Identity, window, 600, [], 1.5, 9, fieldUm: 8);

        Assert.Single(with.Excursions);
        Assert.True(with.Excursions[0].MeanRadiusChangeNm < 0);
        Assert.Equal(with.MeanRadiusNm - without.MeanRadiusNm, with.Excursions[0].MeanRadiusChangeNm, 0.15);
        Assert.True(with.LambdaEffUm < without.LambdaEffUm);
        Assert.False(with.Extrapolated);
    }
}
