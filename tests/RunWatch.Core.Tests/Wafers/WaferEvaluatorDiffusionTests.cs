using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Qc;
using RunWatch.Core.Thermal;
using RunWatch.Core.Wafers;
using RunWatch.Testing.Physics;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Core.Tests.Wafers;

/// <summary>
/// The wafer verdict on the diffusion radius model (the default). Truth comes from the adatom random walk
/// (tests/RunWatch.Testing/Physics, continuous space, no grid), never from the solver under test.
/// </summary>
public sealed class WaferEvaluatorDiffusionTests(ITestOutputHelper output)
{
    /// <summary>The truth's own parameters as a model (what an ideal calibration would accept).</summary>
    private static DiffusionRadiusModel TruthModel() => new(GrowthTruth.Law.Lambda0SquaredUm2, GrowthTruth.Law.ActivationEv, GrowthTruth.KappaNm2PerUm2S,
        GrowthTruth.R0Nm * GrowthTruth.R0Nm, PhysicalConstants.CelsiusToKelvin(610), [], 590, 630, 1200, 2400, GrowthTruth.NoiseNm);

    private static WaferEvaluationInput Input(FieldResult field, DiffusionRadiusModel? model, ThermalExposure? exposure, QcSpecification? spec = null) => new()
    {
        WaferId = "W-INV-D1",
        Recipe = "nw-inv",
        Fields = [field],
        DiffusionModel = model,
        GrowthExposure = exposure,
        GrowthExposureMissing = exposure is null ? "the wafer is linked to no run" : null,
        Thermal = new RunThermalFacts(null, 1.0, 1, null),
        Specification = spec ?? new QcSpecification { MaxAbsBiasNm = 5 },
    };

    [Fact]
    public void Evaluate_DefaultModelWithRandomWalkTruthAndExcursion_PredictsEachWireAndMeanWithin3Percent()
    {
        // 600 °C for 1000 s with a +25 K, 3-minute excursion (invented run); truth by the random walk over that record.
        ThermalRecord record = GrowthTruth.Record(600, 1000, 41, excursionStartS: 400, excursionS: 180, excursionK: 25);
        var truth = GrowthTruth.Wafer(record, GrowthTruth.Law, 141);
        FieldResult field = GrowthTruthFields.ToField("f1.png", truth);
        ThermalExposure exposure = ThermalExposure.FromRecord(record, TemperatureCalibration.Identity, new GrowthWindow(0, record.TimesS[^1]));

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(field, TruthModel(), exposure));

        Assert.Equal(WaferRadiusModel.Diffusion, result.RadiusModel);
        WaferDiffusionFigures d = result.Diffusion!;
        output.WriteLine($"λ(mean {d.MeanTemperatureC:F1} °C) {d.LambdaAtMeanUm:F3} µm, λ_eff {d.LambdaEffUm:F3} µm, range {d.LambdaMinUm:F3}–{d.LambdaMaxUm:F3}, {d.PredictedWires} predicted, {d.GuardedWires} guarded");
        Assert.True(d.PredictedWires >= 15, $"only {d.PredictedWires} unguarded wires");
        var c = result.Comparison!;
        double meanMeasured = result.Wires.Where(w => double.IsFinite(w.PredictedRadiusNm)).Average(w => w.RadiusNm);
        output.WriteLine($"bias {c.BiasNm:F2} nm of {meanMeasured:F1} nm, RMSE {c.RmseNm:F2} nm, r² {c.RSquared:F3}, n {c.Count}");
        Assert.InRange(c.BiasNm / meanMeasured, -0.03, 0.03);
        // Per wire: the walk's Poisson noise (2000 adatoms per wire, a few %) plus 1.5 nm measurement noise, plus the
        // footprint assumption; RMSE within 8 % of the mean radius.
        Assert.True(c.RmseNm < 0.08 * meanMeasured, $"RMSE {c.RmseNm:F2} nm");
        // The truth law has E_λ < 0, so the hot excursion shortens λ: λ_eff lies below λ at the setpoint but above the
        // excursion's λ (DERIVED from λ_eff's definition: a weighted mean of the history's collection).
        double lambdaSet = GrowthTruth.Law.LambdaUm(PhysicalConstants.CelsiusToKelvin(600));
        Assert.InRange(d.LambdaEffUm, GrowthTruth.Law.LambdaUm(PhysicalConstants.CelsiusToKelvin(625)), lambdaSet);
        Assert.Equal(QcOutcome.Pass, Assert.Single(result.Verdict.Rules, r => r.Rule == "prediction-bias").Outcome);
        Assert.DoesNotContain(result.Verdict.Rules, r => r.Rule == WaferEvaluator.RadiusModelRule);
    }

    [Fact]
    public void Evaluate_NoAcceptedDiffusionModel_WarnsSayingWhyAndWhatToDo()
    {
        ThermalRecord record = GrowthTruth.Record(600, 600, 42);
        var field = GrowthTruthFields.ToField("f1.png", (GrowthTruth.Wafer(record, GrowthTruth.Law, 142, 6, 5, 50)));

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(field, null, ThermalExposure.Isothermal(873.15, 600)));

        Assert.Equal(QcOutcome.Warn, result.Verdict.Outcome);
        QcRuleResult rule = Assert.Single(result.Verdict.Rules, r => r.Rule == WaferEvaluator.RadiusModelRule);
        Assert.Equal(QcOutcome.Warn, rule.Outcome);
        Assert.Contains("No accepted diffusion radius model for process 'nw-inv'", rule.Reason, StringComparison.Ordinal);
        Assert.Contains("accept the proposal", rule.Reason, StringComparison.Ordinal);
        Assert.All(result.Wires, w => Assert.True(double.IsNaN(w.PredictedRadiusNm)));
        Assert.Null(result.Comparison);
        Assert.Null(result.Diffusion);
    }

    [Fact]
    public void Evaluate_ModelButNoThermalRecord_WarnsNamingTheRecord()
    {
        ThermalRecord record = GrowthTruth.Record(600, 600, 43);
        var field = GrowthTruthFields.ToField("f1.png", (GrowthTruth.Wafer(record, GrowthTruth.Law, 143, 6, 5, 50)));

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(field, TruthModel(), null));

        QcRuleResult rule = Assert.Single(result.Verdict.Rules, r => r.Rule == WaferEvaluator.RadiusModelRule);
        Assert.Contains("thermal record", rule.Reason, StringComparison.Ordinal);
        Assert.Contains("linked to no run", rule.Reason, StringComparison.Ordinal);
        Assert.Equal(QcOutcome.Warn, result.Verdict.Outcome);
    }

    [Fact]
    public void Evaluate_VoronoiDiscOption_MatchesGeometryRoomZonesAtTheRunsLambda()
    {
        // Isothermal 600 °C for 900 s: ∫A dt = t·A(λ), so each unguarded wire's predicted r² − r₀² must equal κ·t times its
        // Voronoi ∩ disc(λ) area computed directly by the geometry room (the option's definition; the table's
        // interpolation between λ nodes is what is checked).
        ThermalRecord record = GrowthTruth.Record(600, 900, 44);
        var truth = GrowthTruth.Wafer(record, GrowthTruth.Law, 144, 10, 8, 50);
        FieldResult field = GrowthTruthFields.ToField("f1.png", truth);
        double temperatureK = PhysicalConstants.CelsiusToKelvin(600);
        DiffusionRadiusModel model = TruthModel();

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(field, model, ThermalExposure.Isothermal(temperatureK, 900)) with { RadiusModel = WaferRadiusModel.VoronoiDisc });

        Assert.Equal(CaptureAreaMethod.VoronoiDisc, result.Diffusion!.Method);
        double lambda = model.Law.LambdaUm(temperatureK);
        CaptureZoneResult zones = CaptureZones.Compute(truth.Centres, truth.Field,
            new CaptureZoneOptions { DiffusionLength = lambda, GuardRule = GuardRule.UnseenNeighbourCouldCut });
        int checkedWires = 0;
        foreach (WireRow w in result.Wires)
        {
            if (!double.IsFinite(w.PredictedRadiusNm))
            {
                continue;
            }
            int i = w.WireId - 1;
            Assert.False(zones.Guarded[i]);
            double expected = model.KappaNm2PerUm2S * 900 * zones.Areas[i];
            Assert.Equal(expected, (w.PredictedRadiusNm * w.PredictedRadiusNm) - model.R0SquaredNm2, expected * 0.01);
            checkedWires++;
        }
        Assert.True(checkedWires >= 10, $"only {checkedWires} unguarded wires");
    }
}
