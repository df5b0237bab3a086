using RunWatch.Core.ControlCharts;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Storage;

namespace RunWatch.Web.Data;

/// <summary>
/// Builds the wafer map and the per-run trend figures from stored records, for every implementation of
/// <see cref="ILabRecordQueries"/> alike. The figures themselves come from Core.
/// </summary>
public static class LabRecordComposer
{
    /// <summary>One stored field with its newest analysis, if any.</summary>
    public sealed record StoredField(string FieldId, string FileName, double? XMm, double? YMm, FieldResult? Result);

    /// <summary>The wafer map: field figures and field verdicts (with <paramref name="spec"/> when given), outline and uniformity.</summary>
    public static WaferMapView Map(string waferId, string runId, string process, string? verdict, IReadOnlyList<StoredField> fields, QcSpecification? spec)
    {
        ArgumentNullException.ThrowIfNull(fields);
        var points = new List<FieldMapPoint>(fields.Count);
        foreach (StoredField f in fields)
        {
            // The analysis result carries the position too (from the sidecar) when the field record has none.
            double? x = f.XMm ?? f.Result?.PositionXMm;
            double? y = f.YMm ?? f.Result?.PositionYMm;
            FieldFigures? figures = f.Result is { } r ? FieldFigures.From(r) : null;
            VerdictOutcome? outcome = null;
            var reasons = new List<string>();
            if (figures is not null && spec is not null)
            {
                QcVerdict v = FieldQc.Evaluate(figures, f.FileName, process, spec);
                outcome = v.Outcome switch { QcOutcome.Pass => VerdictOutcome.Pass, QcOutcome.Fail => VerdictOutcome.Fail, _ => VerdictOutcome.Review };
                reasons.AddRange(v.Reasons.Select(rule => $"{rule.Outcome.ToString().ToLowerInvariant()}: {rule.Reason}"));
            }
            points.Add(new FieldMapPoint(f.FieldId, f.FileName, x, y, figures, outcome, reasons));
        }
        var placed = points.Where(p => p.XMm is not null && p.YMm is not null).ToList();
        double[] distances = [.. placed.Select(p => p.DistanceMm)];
        double[] means = [.. placed.Select(p => p.Figures?.MeanRadiusNm ?? double.NaN)];
        double farthest = distances.Length == 0 ? 0 : distances.Max();
        return new WaferMapView(waferId, runId, process, verdict, WaferOutline.DiameterHoldingMm(farthest), points, WaferUniformity.From(distances, means));
    }

    /// <summary>A run's trend point from its wafers' newest report digests (wafer figures averaged over the wafers).</summary>
    public static RunTrendPoint TrendPoint(string runId, string chamber, string process, DateTimeOffset start, string? verdict, double? lEffNm, double? tEffC, int excursions,
        IReadOnlyList<WaferReportDigest> digests)
    {
        ArgumentNullException.ThrowIfNull(digests);
        double[] mean = [.. digests.Select(d => d.Statistics?.MeanRadiusNm ?? double.NaN)];
        double[] cv = [.. digests.Select(d => d.Statistics?.RadiusCv ?? double.NaN)];
        // Density: cm⁻² as stored, µm⁻² as shown (1 µm⁻² = 10⁸ cm⁻²).
        double[] density = [.. digests.Select(d => (d.Statistics?.DensityPerCm2 ?? double.NaN) / 1e8)];
        double[] bias = [.. digests.Select(d => d.Agreement?.BiasNm ?? double.NaN)];
        return new RunTrendPoint(runId, chamber, process, start, verdict,
            TrendChart.MeanOfFinite(mean), TrendChart.MeanOfFinite(cv), TrendChart.MeanOfFinite(density),
            lEffNm ?? double.NaN, TrendChart.MeanOfFinite(bias), tEffC ?? double.NaN, excursions);
    }
}
