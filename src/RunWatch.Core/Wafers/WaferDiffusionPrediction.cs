using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Wafers;

/// <summary>
/// Applies an accepted <see cref="DiffusionRadiusModel"/> to a wafer's measured fields over its run's real history:
/// per field the capture areas are solved at a few λ spanning what the history reached (<see cref="CaptureAreaTable"/>,
/// interpolated between them), each wire gets r² = r₀² + κ·∫A dt, and wires whose collection depends on what lies
/// outside the image (the absorbing/saturated bound rule, judged at the largest λ reached) get no prediction.
/// </summary>
/// <param name="PredictedNm">Per field, per entry of <see cref="FieldResult.Wires"/>: the predicted radius, NaN where guarded or not counted.</param>
/// <param name="Figures">λ, λ_eff and counts of the wafer.</param>
public sealed record WaferDiffusionPrediction(IReadOnlyList<double[]> PredictedNm, WaferDiffusionFigures Figures)
{
    /// <summary>Predicts every counted wire of <paramref name="fields"/>.</summary>
    /// <exception cref="ArgumentException">The exposure covers no time, or the options are invalid.</exception>
    public static WaferDiffusionPrediction Compute(IReadOnlyList<FieldResult> fields, DiffusionRadiusModel model, ThermalExposure exposure, CaptureTableOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(fields);
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(exposure);
        if (!(exposure.CoveredS > 0))
        {
            throw new ArgumentException("The run's record covers none of the growth window.", nameof(exposure));
        }
        options ??= new CaptureTableOptions();
        (double lo, double hi) = exposure.LambdaRange(model.Law);
        var predicted = new List<double[]>(fields.Count);
        var tables = new List<(CaptureAreaTable Table, bool[] Guarded)>();
        double collected = 0;
        int used = 0, guardedCount = 0;
        foreach (FieldResult field in fields)
        {
            var perWire = new double[field.Wires.Count];
            Array.Fill(perWire, double.NaN);
            predicted.Add(perWire);
            FieldSinks sinks = FieldSinks.From(field);
            if (sinks.CentresUm.Length == 0)
            {
                continue;
            }
            CaptureAreaTable table = CaptureAreaTable.Build(sinks.CentresUm, sinks.FootprintsUm, sinks.Field, lo / 1.05, hi * 1.05, options);
            FieldPrediction p = FieldPrediction.Compute(model, table, exposure);
            tables.Add((table, p.Guarded));
            collected += EffectiveCaptureLength.UnguardedTotal(p.Guarded, p.IntegralsUm2S);
            for (int s = 0; s < sinks.CentresUm.Length; s++)
            {
                if (!double.IsFinite(sinks.MeasuredRadiiNm[s]))
                {
                    continue;
                }
                if (p.Guarded[s])
                {
                    guardedCount++;
                    continue;
                }
                perWire[sinks.WireIndex[s]] = p.PredictedRadiiNm[s];
                used++;
            }
        }
        double meanC = PhysicalConstants.KelvinToCelsius(exposure.MeanTemperatureK);
        var figures = new WaferDiffusionFigures(options.Method, meanC, exposure.CoveredS, model.Law.LambdaUm(exposure.MeanTemperatureK),
            LambdaEff(tables, collected, exposure.CoveredS, lo / 1.05, hi * 1.05), lo, hi, used, guardedCount, !model.Covers(meanC, exposure.CoveredS));
        return new WaferDiffusionPrediction(predicted, figures);
    }

    /// <summary>
    /// λ_eff over all fields together: the constant λ at which the unguarded sinks of every field, held for the covered
    /// time, collect what they collected over the real history (<see cref="EffectiveCaptureLength"/> for one field).
    /// </summary>
    private static double LambdaEff(List<(CaptureAreaTable Table, bool[] Guarded)> tables, double collectedUm2S, double seconds, double minUm, double maxUm)
    {
        double target = collectedUm2S / seconds;
        if (tables.Count == 0 || !(target > 0))
        {
            return double.NaN;
        }
        double Total(double lambda)
        {
            double total = 0;
            foreach ((CaptureAreaTable table, bool[] guarded) in tables)
            {
                for (int i = 0; i < table.WireCount; i++)
                {
                    total += guarded[i] ? 0 : table.AreaAt(i, lambda);
                }
            }
            return total;
        }
        double lo = Math.Log(minUm), hi = Math.Log(maxUm);
        if (target < Total(minUm) * (1 - 1e-9) || target > Total(maxUm) * (1 + 1e-9))
        {
            return double.NaN;
        }
        for (int k = 0; k < 60; k++)
        {
            double mid = 0.5 * (lo + hi);
            if (Total(Math.Exp(mid)) < target)
            {
                lo = mid;
            }
            else
            {
                hi = mid;
            }
        }
        return Math.Exp(0.5 * (lo + hi));
    }
}
