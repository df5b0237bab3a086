using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Model.Diffusion;

public sealed class ThermalExposureTests
{
    [Fact]
    public void FromRecord_HeldTemperatureWithGap_CoversAllButTheGap()
    {
        double[] t = [0, 5, 10, 50, 55, 60];
        double[] c = [600, 600, 600, 600, 600, 600];
        var record = new ThermalRecord("tc", t, c);

        ThermalExposure e = ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, new GrowthWindow(2, 58), maxGapS: 10);

        Assert.Equal(56, e.WindowS, 12);
        Assert.Equal(16, e.CoveredS, 12);
        Assert.Equal(40, e.UncoveredS, 12);
        Assert.Equal(873.15, e.MeanTemperatureK, 9);
    }

    /// <summary>A linear ramp: the mean temperature is the midpoint (DERIVED), and replacing it by a setpoint gives the setpoint.</summary>
    [Fact]
    public void FromRecord_RampAndReplacement_MeanIsMidpointAndReplacedReadsSetpoint()
    {
        double[] t = Enumerable.Range(0, 101).Select(i => (double)i).ToArray();
        double[] c = t.Select(x => 590 + (0.2 * x)).ToArray();
        var record = new ThermalRecord("tc", t, c);

        ThermalExposure ramp = ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, new GrowthWindow(0, 100));
        ThermalExposure flat = ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, new GrowthWindow(0, 100), 10, [new GrowthWindow(0, 100)], 600);

        Assert.Equal(600 + 273.15, ramp.MeanTemperatureK, 9);
        Assert.Equal(100, ramp.CoveredS, 12);
        Assert.Equal(1, flat.TemperaturesK.Length);
        Assert.Equal(873.15, flat.TemperaturesK[0], 9);
    }

    /// <summary>λ_eff of a history held at one temperature is that temperature's λ (DERIVED from the definition).</summary>
    [Fact]
    public void EffectiveCaptureLength_Isothermal_IsTheLambdaOfThatTemperature()
    {
        var field = CaptureField.Rectangle(8, 6);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 1.5, 2);
        CaptureAreaTable table = CaptureAreaTable.Build(centres, radii, field, 0.2, 0.6);
        var model = new DiffusionRadiusModel(CaptureLengthLaw.Through(0.4, 880, -1).Lambda0SquaredUm2, -1, 2.5, 400, 880, [], 600, 620, 1000, 2000, 1);

        FieldPrediction p = FieldPrediction.Compute(model, table, ThermalExposure.Isothermal(880, 1800));

        Assert.Contains(false, p.Guarded);
        Assert.Equal(0.4, p.LambdaEffUm, 6);
        Assert.Equal(0.4, p.LambdaAtMeanUm, 12);
    }

    /// <summary>
    /// An excursion held at one temperature changes ∫A dt by Δt·(A(λ_exc) − A(λ_set)) exactly (DERIVED: the collection
    /// is a sum over time); the reported mean radius change equals that, and a hotter excursion with E_λ &lt; 0 makes wires thinner.
    /// </summary>
    [Fact]
    public void ExcursionRadiusEffect_HeldExcursion_MatchesDirectDifferenceAndSign()
    {
        var field = CaptureField.Rectangle(8, 6);
        (Point2D[] centres, double[] radii) = DiffusionTestFields.Poisson(field, 1.5, 2);
        CaptureAreaTable table = CaptureAreaTable.Build(centres, radii, field, 0.2, 0.6);
        var model = new DiffusionRadiusModel(CaptureLengthLaw.Through(0.4, 880, -1).Lambda0SquaredUm2, -1, 2.5, 400, 880, [], 600, 620, 1000, 2000, 1);
        double[] t = Enumerable.Range(0, 1801).Select(i => (double)i).ToArray();
        double[] c = t.Select(x => x >= 600 && x <= 780 ? 625.0 : 600.0).ToArray();
        var record = new ThermalRecord("tc", t, c);

        IReadOnlyList<ExcursionRadiusEffect> effects = ExcursionRadiusEffect.Compute(model, table, record, TemperatureCalibration.Identity,
            new GrowthWindow(0, 1800), 600, [new GrowthWindow(599.5, 780.5)]);

        FieldPrediction real = FieldPrediction.Compute(model, table, ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, new GrowthWindow(0, 1800)));
        double lambdaSet = model.LambdaAtUm(600), lambdaExc = model.LambdaAtUm(625);
        double sum = 0;
        int n = 0;
        for (int i = 0; i < centres.Length; i++)
        {
            if (!real.Guarded[i])
            {
                double without = real.IntegralsUm2S[i] - (181 * (table.AreaAt(i, lambdaExc) - table.AreaAt(i, lambdaSet)));
                sum += real.PredictedRadiiNm[i] - model.RadiusNm(without);
                n++;
            }
        }
        Assert.Single(effects);
        Assert.True(n >= 10, $"only {n} unguarded wires");
        Assert.True(effects[0].MeanRadiusChangeNm < 0, "hotter with E_λ < 0 shortens λ");
        Assert.Equal(sum / n, effects[0].MeanRadiusChangeNm, 0.02);
        Assert.True(effects[0].LambdaEffChangeUm < 0);
    }
}
