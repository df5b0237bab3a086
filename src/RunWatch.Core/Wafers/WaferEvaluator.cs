using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;

namespace RunWatch.Core.Wafers;

/// <summary>
/// Pure evaluation of one wafer from its analysed fields: pools the wires, predicts each wire's radius with the
/// configured radius model, compares predicted with measured per wire, and judges the result against the recipe's
/// spec. The default model is the diffusion solution over the run's real history (WaferEvaluator.Diffusion.cs); the
/// Â regression (below: applies or, lacking one, fits the process's regression, finds the best-fit capture radius and
/// predicts the radius distribution from L_eff) is kept as a named option.
/// </summary>
public static partial class WaferEvaluator
{
    /// <summary>Wires that enter the statistics and the model: vertical, clear of the image edge and band, with a radius (a bare droplet without a contact angle has none).</summary>
    public static bool Counts(FieldWire w) => w.Vertical && w.Interior && double.IsFinite(w.RadiusNm);

    public static WaferEvaluation Evaluate(WaferEvaluationInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.RadiusModel != WaferRadiusModel.CaptureAreaRegression)
        {
            return EvaluateWithDiffusion(input);
        }
        var notes = new List<string>();
        var rows = new List<WireRow>();
        var areas = new List<double>();
        var radii = new List<double>();
        double areaCm2 = 0;
        int interior = 0;
        int vertical = 0;
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
                if (!Counts(w))
                {
                    continue;
                }
                if (w.ZoneNormalised is { } a && a > 0)
                {
                    areas.Add(a);
                    radii.Add(w.RadiusNm);
                }
            }
        }

        RadiusModelFit? model = input.AcceptedModel;
        RadiusModelComparison? ownFits = null;
        if (areas.Count >= 3)
        {
            ownFits = RadiusModelFitter.FitAndSelect(areas.ToArray(), radii.ToArray());
        }
        bool fittedHere = false;
        if (model is null && ownFits is not null)
        {
            model = ownFits.SelectedFit;
            fittedHere = true;
            notes.Add("no accepted radius model for this process yet: the model was fitted on this wafer, so predicted against measured is in-sample");
        }
        else if (model is null)
        {
            notes.Add("too few wires with an unguarded capture zone to fit or apply a radius model");
        }

        foreach (FieldResult field in input.Fields)
        {
            foreach (FieldWire w in field.Wires)
            {
                if (!Counts(w))
                {
                    continue;
                }
                double a = w.ZoneNormalised ?? double.NaN;
                double predicted = model is not null && a > 0 ? model.Predict(a) : double.NaN;
                rows.Add(new WireRow(field.FieldName, w.Id, w.XNm, w.YNm, w.RadiusNm, a, predicted, w.Vertical));
            }
        }

        WireStatistics? stats = rows.Count >= 2 && areaCm2 > 0 ? WireStatistics.From(rows, areaCm2) : null;
        double? densityPerCm2 = areaCm2 > 0 ? CountWires(input.Fields) / areaCm2 : null;

        PredictedVsMeasured? comparison = null;
        if (model is not null && areas.Count >= 2)
        {
            comparison = PredictionComparison.Compare(model, areas.ToArray(), radii.ToArray());
        }

        RadiusPrediction? prediction = null;
        if (model is not null && input.Thermal.LEffNm is { } lEff && densityPerCm2 is { } density && density > 0)
        {
            prediction = NucleationFieldSimulator.Predict(new RadiusPredictionRequest(model, lEff, density, input.PredictionFields, input.PredictionSeed));
        }

        CaptureRadiusFit? best = null;
        if (input.Thermal.LEffNm is { } l && model is not null)
        {
            best = FindBestCaptureRadius(input, l, model.Kind, notes);
        }

        double? yield = interior > 0 ? vertical / (double)interior : null;
        var qcInput = new WaferQcInput(
            input.WaferId,
            input.Recipe,
            rows.Count,
            stats?.MeanRadiusNm,
            stats?.RadiusCv,
            densityPerCm2,
            yield,
            fittedHere ? null : comparison?.BiasNm,
            input.Thermal.ExcursionCount,
            input.Thermal.MaxAbsRelativeLChange,
            input.Thermal.Coverage);
        if (fittedHere)
        {
            notes.Add("the bias rule is not judged: with the model fitted on this wafer the bias is zero by construction");
        }
        QcVerdict verdict = QcEvaluator.Evaluate(qcInput, input.Specification);
        return new WaferEvaluation
        {
            Wires = rows,
            Statistics = stats,
            Model = model,
            ModelFittedOnThisWafer = fittedHere,
            ThisWaferFits = ownFits,
            BestCaptureRadius = best,
            Prediction = prediction,
            Comparison = comparison,
            Verdict = verdict,
            Notes = notes,
            AnalysedAreaCm2 = areaCm2,
            RadiusModel = WaferRadiusModel.CaptureAreaRegression,
        };
    }

    private static int CountWires(IReadOnlyList<FieldResult> fields)
    {
        int n = 0;
        foreach (FieldResult f in fields)
        {
            n += f.Wires.Count;
        }
        return n;
    }

    /// <summary>
    /// Scans the capture radius: zones are recomputed from the measured centroids at each trial L. The wires used are
    /// the ones whose zone is unguarded even at the largest L scanned, so every trial judges the same wires.
    /// </summary>
    private static CaptureRadiusFit? FindBestCaptureRadius(WaferEvaluationInput input, double lEffNm, RadiusModelKind kind, List<string> notes)
    {
        double minNm = lEffNm * input.CaptureRadiusSearchMin;
        double maxNm = lEffNm * input.CaptureRadiusSearchMax;
        var perField = new List<(FieldResult Field, Point2D[] Points, int[] Used)>();
        var radii = new List<double>();
        foreach (FieldResult field in input.Fields)
        {
            var points = new Point2D[field.Wires.Count];
            for (int i = 0; i < points.Length; i++)
            {
                points[i] = new Point2D(field.Wires[i].XNm, field.Wires[i].YNm);
            }
            CaptureZoneResult atMax = CaptureZones.Compute(points, Bounds(field), new CaptureZoneOptions { DiffusionLength = maxNm });
            var used = new List<int>();
            for (int i = 0; i < points.Length; i++)
            {
                if (!atMax.Guarded[i] && Counts(field.Wires[i]))
                {
                    used.Add(i);
                    radii.Add(field.Wires[i].RadiusNm);
                }
            }
            perField.Add((field, points, used.ToArray()));
        }
        if (radii.Count < 5)
        {
            notes.Add($"best-fit capture radius not searched: only {radii.Count} wires are clear of the guard zone at L = {maxNm:0} nm");
            return null;
        }
        void Evaluate(double captureRadiusNm, Span<double> normalisedAreas)
        {
            int k = 0;
            foreach (var (field, points, used) in perField)
            {
                CaptureZoneResult zones = CaptureZones.Compute(points, Bounds(field), new CaptureZoneOptions { DiffusionLength = captureRadiusNm });
                foreach (int i in used)
                {
                    normalisedAreas[k++] = zones[i].NormalisedArea;
                }
            }
        }
        return CaptureRadiusSearch.Find(radii.ToArray(), Evaluate, kind, minNm, maxNm);
    }

    private static CaptureField Bounds(FieldResult field) => CaptureField.Rectangle(field.WidthNm, field.AnalysedHeightNm);
}
