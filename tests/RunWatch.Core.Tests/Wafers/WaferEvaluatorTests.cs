using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using RunWatch.Core.PointPatterns;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using Xunit;

namespace RunWatch.Core.Tests.Wafers;

public sealed class WaferEvaluatorTests
{
    private const double WidthNm = 20_000;
    private const double HeightNm = 15_000;
    private const double LNm = 600;

    /// <summary>
    /// A synthetic field whose wire radii follow r = a + b·Â exactly at the given L, plus seeded noise (invented
    /// test data). Â comes from the geometry room's capture zones, so the evaluation sees a self-consistent wafer.
    /// </summary>
    private static FieldResult SyntheticField(string name, int seed, double a, double b, double noiseNm, double densityPerUm2 = 1.0)
    {
        var bounds = CaptureField.Rectangle(WidthNm, HeightNm);
        Point2D[] sites = NucleationSites.Poisson(bounds, densityPerUm2 * 1e-6, seed);
        CaptureZoneResult zones = CaptureZones.Compute(sites, bounds, new CaptureZoneOptions { DiffusionLength = LNm });
        var random = new Random(seed);
        var wires = new List<FieldWire>(sites.Length);
        for (int i = 0; i < sites.Length; i++)
        {
            double ahat = zones[i].NormalisedArea;
            double noise = noiseNm * (random.NextDouble() - 0.5) * 2;
            bool interior = !zones.Guarded[i];
            wires.Add(new FieldWire(i + 1, sites[i].X, sites[i].Y, a + (b * ahat) + noise, Vertical: true, Interior: interior,
                ZoneNormalised: interior ? ahat : null));
        }
        return new FieldResult
        {
            FieldName = name,
            PixelSizeNm = 5,
            WidthNm = WidthNm,
            AnalysedHeightNm = HeightNm,
            Threshold = "1000 (otsu)",
            AnalysedAreaCm2 = WidthNm * HeightNm * 1e-14,
            DensityPerCm2 = sites.Length / (WidthNm * HeightNm * 1e-14),
            VerticalYield = 1,
            DiffusionLengthNm = LNm,
            Wires = wires,
        };
    }

    private static WaferEvaluationInput Input(IReadOnlyList<FieldResult> fields, RadiusModelFit? accepted, QcSpecification? spec = null) => new()
    {
        WaferId = "W-TEST-1",
        Recipe = "invented-recipe",
        Fields = fields,
        RadiusModel = WaferRadiusModel.CaptureAreaRegression, // these tests check the regression option
        AcceptedModel = accepted,
        Thermal = new RunThermalFacts(LNm, 1.0, 0, 0.0),
        Specification = spec ?? new QcSpecification(),
        PredictionFields = 2,
    };

    [Fact]
    public void Evaluate_NoAcceptedModel_FitsOnWaferAndRecoversKnownLine()
    {
        var fields = new[] { SyntheticField("f1.png", 11, 20, 30, 1.0), SyntheticField("f2.png", 12, 20, 30, 1.0) };

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(fields, null));

        Assert.True(result.ModelFittedOnThisWafer);
        Assert.NotNull(result.ThisWaferFits);
        RadiusModelFit linear = result.ThisWaferFits!.Linear;
        // Known parameters (invented, DERIVED test construction): intercept 20 nm, slope 30 nm per unit Â.
        Assert.InRange(20.0, linear.Parameters[0].Lower95, linear.Parameters[0].Upper95);
        Assert.InRange(30.0, linear.Parameters[1].Lower95, linear.Parameters[1].Upper95);
        Assert.Contains(result.Notes, n => n.Contains("in-sample", StringComparison.Ordinal));
        // In-sample bias is zero by construction, so the bias rule must not pass the wafer on it: it is left unmeasured.
        var withBiasRule = WaferEvaluator.Evaluate(Input(fields, null, new QcSpecification { MaxAbsBiasNm = 2 }));
        Assert.Null(Assert.Single(withBiasRule.Verdict.Rules, r => r.Rule == "prediction-bias").Measured);
    }

    [Fact]
    public void Evaluate_AcceptedModelBiased_BiasMeasuredAndJudged()
    {
        var fields = new[] { SyntheticField("f1.png", 21, 20, 30, 0.5) };
        RadiusModelFit truth = RadiusModelFitter.FitLinear(
            fields[0].Wires.Where(w => w.ZoneNormalised is not null).Select(w => w.ZoneNormalised!.Value).ToArray(),
            fields[0].Wires.Where(w => w.ZoneNormalised is not null).Select(w => w.RadiusNm + 5).ToArray());
        var spec = new QcSpecification { MaxAbsBiasNm = 2, WarnAbsBiasNm = 1 };

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(fields, truth, spec));

        Assert.False(result.ModelFittedOnThisWafer);
        Assert.NotNull(result.Comparison);
        // The accepted model predicts 5 nm more than measured for every wire: bias +5 nm by construction.
        Assert.Equal(5.0, result.Comparison!.BiasNm, 6);
        Assert.Equal(QcOutcome.Fail, result.Verdict.Outcome);
    }

    [Fact]
    public void Evaluate_BestCaptureRadius_FindsTheLThatGeneratedTheRadii()
    {
        var fields = new[] { SyntheticField("f1.png", 31, 15, 40, 0.2), SyntheticField("f2.png", 32, 15, 40, 0.2) };

        WaferEvaluation result = WaferEvaluator.Evaluate(Input(fields, null));

        Assert.NotNull(result.BestCaptureRadius);
        // The radii were generated from zones at L = 600 nm: the best-fit capture radius recovers it within 5 %.
        Assert.InRange(result.BestCaptureRadius!.CaptureRadiusNm, LNm * 0.95, LNm * 1.05);
    }

    [Fact]
    public void Evaluate_NoWires_VerdictStillGivenWithReasons()
    {
        var empty = new FieldResult
        {
            FieldName = "black.png", PixelSizeNm = 5, WidthNm = WidthNm, AnalysedHeightNm = HeightNm, Threshold = "0 (otsu)",
            AnalysedAreaCm2 = WidthNm * HeightNm * 1e-14, Wires = [],
        };
        var spec = new QcSpecification { MinWireCount = 10 };

        WaferEvaluation result = WaferEvaluator.Evaluate(Input([empty], null, spec));

        Assert.Empty(result.Wires);
        Assert.Null(result.Statistics);
        Assert.NotEqual(QcOutcome.Pass, result.Verdict.Outcome);
        Assert.NotEmpty(result.Verdict.Reasons);
    }
}
