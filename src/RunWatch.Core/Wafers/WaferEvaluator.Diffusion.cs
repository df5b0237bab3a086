using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;

namespace RunWatch.Core.Wafers;

/// <summary>The wafer verdict on the diffusion radius model (the default).</summary>
public static partial class WaferEvaluator
{
    /// <summary>Rule id of the verdict's statement about the radius model when it could not predict.</summary>
    public const string RadiusModelRule = "radius-model";

    private static WaferEvaluation EvaluateWithDiffusion(WaferEvaluationInput input)
    {
        var notes = new List<string>();
        double areaCm2 = 0;
        int interior = 0, vertical = 0;
        foreach (FieldResult field in input.Fields)
        {
            areaCm2 += field.AnalysedAreaCm2;
            foreach (FieldWire w in field.Wires)
            {
                if (w.Interior)
                {
                    interior++;
                    vertical += w.Vertical ? 1 : 0;
                }
            }
        }
        string process = input.Process ?? input.Recipe;
        string? missing = null;
        WaferDiffusionPrediction? prediction = null;
        var options = input.CaptureTable ?? new CaptureTableOptions();
        if (input.RadiusModel == WaferRadiusModel.VoronoiDisc)
        {
            options = new CaptureTableOptions
            {
                CellSizeUm = options.CellSizeUm, NodeRatio = options.NodeRatio, GuardTolerance = options.GuardTolerance,
                BoundsAtEveryNode = options.BoundsAtEveryNode, Solver = options.Solver, MaxDegreeOfParallelism = options.MaxDegreeOfParallelism,
                Method = CaptureAreaMethod.VoronoiDisc,
            };
        }
        if (input.DiffusionModel is null)
        {
            missing = $"No accepted diffusion radius model for process '{process}': no wire radius is predicted and the prediction is not judged. " +
                "Refit the process on the Process model screen (wafers grown at three or more temperatures, with their runs' thermal records) and accept the proposal.";
        }
        else if (input.GrowthExposure is not { CoveredS: > 0 } exposure)
        {
            missing = "The diffusion model needs the run's thermal record over the growth window, and there is none: " +
                (input.GrowthExposureMissing ?? "the record covers none of the window") + ". Link the wafer to its run, or check the run's temperature channel.";
        }
        else
        {
            try
            {
                prediction = WaferDiffusionPrediction.Compute(input.Fields, input.DiffusionModel, exposure, options);
            }
            catch (ArgumentException ex)
            {
                missing = "The diffusion model could not be applied to this wafer's fields: " + ex.Message;
            }
        }

        var rows = new List<WireRow>();
        var predicted = new List<double>();
        var measured = new List<double>();
        for (int f = 0; f < input.Fields.Count; f++)
        {
            FieldResult field = input.Fields[f];
            for (int i = 0; i < field.Wires.Count; i++)
            {
                FieldWire w = field.Wires[i];
                if (!Counts(w))
                {
                    continue;
                }
                double p = prediction?.PredictedNm[f][i] ?? double.NaN;
                rows.Add(new WireRow(field.FieldName, w.Id, w.XNm, w.YNm, w.RadiusNm, w.ZoneNormalised ?? double.NaN, p, w.Vertical));
                predicted.Add(p);
                measured.Add(w.RadiusNm);
            }
        }

        PredictedVsMeasured? comparison = null;
        if (prediction is not null)
        {
            WaferDiffusionFigures d = prediction.Figures;
            if (d.PredictedWires >= 2)
            {
                comparison = PredictionComparison.CompareRadii(predicted.ToArray(), measured.ToArray());
            }
            else
            {
                missing = $"Only {d.PredictedWires} measured wire(s) are clear of the field edge at λ up to {d.LambdaMaxUm * 1000:0} nm " +
                    $"({d.GuardedWires} guarded: their collection depends on what lies outside the image). Image larger fields, or more of them.";
            }
            if (d.Extrapolated)
            {
                notes.Add($"this wafer ({d.MeanTemperatureC:0.0} °C, {d.CoveredS:0} s) lies outside the diffusion model's calibrated range " +
                    $"({input.DiffusionModel!.CalibratedMinC:0.0}–{input.DiffusionModel.CalibratedMaxC:0.0} °C, {input.DiffusionModel.CalibratedMinS:0}–{input.DiffusionModel.CalibratedMaxS:0} s): the prediction extrapolates");
            }
            if (d.GuardedWires > 0)
            {
                notes.Add($"{d.GuardedWires} measured wire(s) near the field edges have no prediction: what they collected depends on what lies outside the image");
            }
        }

        WireStatistics? stats = rows.Count >= 2 && areaCm2 > 0 ? WireStatistics.From(rows, areaCm2) : null;
        double? densityPerCm2 = areaCm2 > 0 ? CountWires(input.Fields) / areaCm2 : null;
        double? yield = interior > 0 ? vertical / (double)interior : null;
        var qcInput = new WaferQcInput(
            input.WaferId,
            input.Recipe,
            rows.Count,
            stats?.MeanRadiusNm,
            stats?.RadiusCv,
            densityPerCm2,
            yield,
            comparison?.BiasNm,
            input.Thermal.ExcursionCount,
            input.Thermal.MaxAbsRelativeLChange,
            input.Thermal.Coverage);
        QcVerdict verdict = QcEvaluator.Evaluate(qcInput, input.Specification);
        if (missing is not null)
        {
            notes.Add(missing);
            verdict = verdict with
            {
                Outcome = verdict.Outcome > QcOutcome.Warn ? verdict.Outcome : QcOutcome.Warn,
                Rules = [.. verdict.Rules, new QcRuleResult(RadiusModelRule, "Radius model applied", null, "diffusion model", "", "", QcOutcome.Warn, missing)],
            };
        }
        return new WaferEvaluation
        {
            Wires = rows,
            Statistics = stats,
            Comparison = comparison,
            Verdict = verdict,
            Notes = notes,
            AnalysedAreaCm2 = areaCm2,
            RadiusModel = input.RadiusModel,
            Diffusion = prediction?.Figures,
            DiffusionModel = prediction is null ? null : input.DiffusionModel,
        };
    }
}
