using RunWatch.Storage;

namespace RunWatch.Web.Data.Store;

/// <summary>What a run's wafers say about the run: its verdict (the worst of its wafers' latest) and the before-SEM prediction.</summary>
public sealed partial class StoreWaferData
{
    private static readonly string[] VerdictOrder = ["pass", "warn", "fail"];

    /// <summary>Per stored run id, the worst latest verdict of its wafers, as the reports spell it in capitals (PASS, WARN, FAIL).</summary>
    public async Task<IReadOnlyDictionary<long, string>> GetRunVerdictsAsync(CancellationToken cancellationToken)
    {
        var worst = new Dictionary<long, int>();
        foreach (RunWaferVerdict v in await wafers.GetLatestRunVerdictsAsync(cancellationToken).ConfigureAwait(false))
        {
            int rank = Array.IndexOf(VerdictOrder, v.Verdict.ToLowerInvariant());
            if (rank >= 0 && (!worst.TryGetValue(v.RunId, out int current) || rank > current))
            {
                worst[v.RunId] = rank;
            }
        }
        return worst.ToDictionary(p => p.Key, p => VerdictOrder[p.Value].ToUpperInvariant());
    }

    /// <summary>
    /// The before-SEM radius prediction the pipeline wrote into the newest JSON summary of one of the run's wafers
    /// (it comes from the run's L_eff and the model in force), or null when no wafer of the run has been reported.
    /// </summary>
    public async Task<RadiusPrediction?> GetRunPredictionAsync(long runId, CancellationToken cancellationToken)
    {
        WaferReportRecord? newest = null;
        foreach (WaferRecord wafer in await wafers.ListWafersAsync(10_000, cancellationToken).ConfigureAwait(false))
        {
            if (wafer.RunId != runId)
            {
                continue;
            }
            var reports = await wafers.GetReportsAsync(wafer.Name, cancellationToken).ConfigureAwait(false);
            foreach (WaferReportRecord r in reports)
            {
                if (r.Format == "json" && r.SummaryJson is not null && (newest is null || r.CreatedAt > newest.CreatedAt))
                {
                    newest = r;
                }
            }
        }
        if (newest?.SummaryJson is not { } json)
        {
            return null;
        }
        return WaferReportDigestJson.Read(json).Prediction is { } p ? new RadiusPrediction(p.MeanRadiusNm, p.RadiusSdNm, p.P05Nm, p.P95Nm) : null;
    }

    /// <summary>Mean Clark–Evans R over the wafer's analysed fields (each field's own R), NaN when none has one.</summary>
    private static double MeanClarkEvans(IReadOnlyList<AnalysisRecord> analyses)
    {
        double sum = 0;
        int n = 0;
        foreach (AnalysisRecord a in analyses)
        {
            if (a.ResultsJson is not { } results)
            {
                continue;
            }
            double r = FieldResultJson.Read(results).ClarkEvansR ?? double.NaN;
            if (double.IsFinite(r))
            {
                sum += r;
                n++;
            }
        }
        return n == 0 ? double.NaN : sum / n;
    }

    private static double MeanNormalisedArea(IReadOnlyList<WireMeasurement> wires)
    {
        double sum = 0;
        int n = 0;
        foreach (WireMeasurement w in wires)
        {
            if (double.IsFinite(w.NormalisedCaptureArea))
            {
                sum += w.NormalisedCaptureArea;
                n++;
            }
        }
        return n == 0 ? double.NaN : sum / n;
    }
}
