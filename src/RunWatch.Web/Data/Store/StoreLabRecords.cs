using System.Globalization;
using RunWatch.Core.Qc;
using RunWatch.Storage;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// <see cref="ILabRecordQueries"/> over the daemon's store: wafers and their newest report digests, fields with
/// their stored positions and newest analyses, runs with their thermal figures, and the recipe's QC specification
/// for the field verdicts (when the host registered the catalogue).
/// </summary>
public sealed class StoreLabRecords(IRunWatchStore store, IWaferStore? waferStore = null, QcSpecificationCatalog? specifications = null) : ILabRecordQueries
{
    private const int MaxWafers = 10_000;
    private const int MaxRuns = 1000;
    private static readonly string[] VerdictOrder = ["pass", "warn", "fail"];

    // A host without the wafer pipeline has no wafer tables to read: the screens then show no wafers.
    private readonly IWaferStore? _wafers = waferStore ?? store as IWaferStore;

    public async Task<IReadOnlyList<WaferListRow>> ListWafersAsync(CancellationToken cancellationToken)
    {
        if (_wafers is not { } wafers)
        {
            return [];
        }
        var runs = await RunsByIdAsync(cancellationToken).ConfigureAwait(false);
        var rows = new List<WaferListRow>();
        foreach (WaferRecord w in await wafers.ListWafersAsync(MaxWafers, cancellationToken).ConfigureAwait(false))
        {
            RunRecord? run = w.RunId is { } id && runs.TryGetValue(id, out RunRecord? r) ? r : null;
            WaferReportRecord? json = await NewestDigestAsync(wafers, w.Name, cancellationToken).ConfigureAwait(false);
            WaferReportDigest? digest = json?.SummaryJson is { } s ? WaferReportDigestJson.Read(s) : null;
            int fields = (await wafers.GetFieldsOfWaferAsync(w.Name, cancellationToken).ConfigureAwait(false)).Count;
            rows.Add(new WaferListRow(w.Name, run?.Name ?? "", run?.Chamber ?? "", w.Process ?? run?.Recipe ?? "",
                json?.Verdict.ToUpperInvariant(), run?.StartedAt ?? w.CreatedAt, digest?.Statistics?.MeanRadiusNm ?? double.NaN, fields));
        }
        return [.. rows.OrderByDescending(r => r.Date).ThenBy(r => r.WaferId, StringComparer.Ordinal)];
    }

    public async Task<WaferMapView?> GetWaferMapAsync(string waferId, CancellationToken cancellationToken)
    {
        if (_wafers is not { } wafers)
        {
            return null;
        }
        WaferRecord? wafer = await wafers.GetWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        if (wafer is null)
        {
            return null;
        }
        RunRecord? run = await wafers.FindRunOfWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        string process = wafer.Process ?? run?.Recipe ?? "";
        var fields = new List<LabRecordComposer.StoredField>();
        foreach (FieldRecord f in await wafers.GetFieldsOfWaferAsync(waferId, cancellationToken).ConfigureAwait(false))
        {
            AnalysisRecord? a = await wafers.GetLatestAnalysisAsync(f.Id, cancellationToken).ConfigureAwait(false);
            var result = a is { Status: "done", ResultsJson: { } json } ? FieldResultJson.Read(json) : null;
            fields.Add(new LabRecordComposer.StoredField(f.Id.ToString(CultureInfo.InvariantCulture), f.RelativePath, f.PositionXMm, f.PositionYMm, result));
        }
        QcSpecification? spec = specifications is null ? null : await specifications.SpecificationForAsync(process, cancellationToken).ConfigureAwait(false);
        WaferReportRecord? newest = await NewestDigestAsync(wafers, waferId, cancellationToken).ConfigureAwait(false);
        return LabRecordComposer.Map(waferId, run?.Name ?? "", process, newest?.Verdict.ToUpperInvariant(), fields, spec);
    }

    public async Task<IReadOnlyList<RunTrendPoint>> GetRunTrendPointsAsync(CancellationToken cancellationToken)
    {
        if (_wafers is not { } wafers)
        {
            return [];
        }
        var runs = await RunsByIdAsync(cancellationToken).ConfigureAwait(false);
        var digests = new Dictionary<long, List<WaferReportDigest>>();
        var verdicts = new Dictionary<long, int>();
        var processes = new Dictionary<long, string>();
        foreach (WaferRecord w in await wafers.ListWafersAsync(MaxWafers, cancellationToken).ConfigureAwait(false))
        {
            if (w.RunId is not { } runId || !runs.ContainsKey(runId))
            {
                continue;
            }
            if (w.Process is { Length: > 0 } p)
            {
                processes.TryAdd(runId, p);
            }
            WaferReportRecord? json = await NewestDigestAsync(wafers, w.Name, cancellationToken).ConfigureAwait(false);
            if (json?.SummaryJson is not { } summary)
            {
                continue;
            }
            if (!digests.TryGetValue(runId, out var list))
            {
                digests[runId] = list = [];
            }
            list.Add(WaferReportDigestJson.Read(summary));
            int rank = Array.IndexOf(VerdictOrder, json.Verdict.ToLowerInvariant());
            if (rank >= 0 && (!verdicts.TryGetValue(runId, out int current) || rank > current))
            {
                verdicts[runId] = rank;
            }
        }
        var points = new List<RunTrendPoint>();
        foreach (RunRecord run in runs.Values.OrderBy(r => r.StartedAt))
        {
            digests.TryGetValue(run.Id, out var list);
            if (list is null && run.LEffNm is null)
            {
                continue;
            }
            int excursions = run.Excursions?.Count(e => e.InGrowthWindow && !e.SuppressedByDesign) ?? 0;
            points.Add(LabRecordComposer.TrendPoint(run.Name, run.Chamber, processes.TryGetValue(run.Id, out string? p) ? p : run.Recipe ?? "",
                run.StartedAt, verdicts.TryGetValue(run.Id, out int v) ? VerdictOrder[v].ToUpperInvariant() : null, run.LEffNm, run.TEffC, excursions, list ?? []));
        }
        return points;
    }

    private async Task<Dictionary<long, RunRecord>> RunsByIdAsync(CancellationToken cancellationToken) =>
        (await store.ListRunsAsync(null, null, MaxRuns, cancellationToken).ConfigureAwait(false)).ToDictionary(r => r.Id);

    private static async Task<WaferReportRecord?> NewestDigestAsync(IWaferStore wafers, string wafer, CancellationToken cancellationToken)
    {
        var reports = await wafers.GetReportsAsync(wafer, cancellationToken).ConfigureAwait(false);
        return reports.Where(r => r.Format == "json").OrderByDescending(r => r.CreatedAt).FirstOrDefault();
    }
}
