using RunWatch.Core.Qc;
using RunWatch.Storage;
using RunWatch.Web.Data;

namespace RunWatch.Testing.Dashboard;

/// <summary>
/// An in-memory <see cref="ILabRecordQueries"/> for tests: wafers with their stored fields and report digest, runs
/// with their thermal figures. It has no statistics of its own: maps and trend points are built by the dashboard's
/// <see cref="LabRecordComposer"/> (figures from Core), as over the store. Thread-safe.
/// </summary>
public sealed class InMemoryLabRecords : ILabRecordQueries
{
    private readonly Lock _gate = new();
    private readonly List<WaferEntry> _wafers = [];
    private readonly List<RunEntry> _runs = [];

    /// <summary>A stored wafer.</summary>
    public sealed record WaferEntry(string WaferId, string RunId, string Chamber, string Process, DateTimeOffset Date, string? Verdict,
        IReadOnlyList<LabRecordComposer.StoredField> Fields, WaferReportDigest? Digest, QcSpecification? Specification);

    /// <summary>A stored run.</summary>
    public sealed record RunEntry(string RunId, string Chamber, string Process, DateTimeOffset Start, double? LEffNm, double? TEffC, int Excursions);

    public void AddWafer(WaferEntry wafer)
    {
        ArgumentNullException.ThrowIfNull(wafer);
        lock (_gate)
        {
            _wafers.RemoveAll(w => w.WaferId == wafer.WaferId);
            _wafers.Add(wafer);
        }
    }

    public void AddRun(RunEntry run)
    {
        ArgumentNullException.ThrowIfNull(run);
        lock (_gate)
        {
            _runs.RemoveAll(r => r.RunId == run.RunId);
            _runs.Add(run);
        }
    }

    public Task<IReadOnlyList<WaferListRow>> ListWafersAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<WaferListRow> rows = [.. _wafers
                .Select(w => new WaferListRow(w.WaferId, w.RunId, w.Chamber, w.Process, w.Verdict, w.Date, w.Digest?.Statistics?.MeanRadiusNm ?? double.NaN, w.Fields.Count))
                .OrderByDescending(r => r.Date)];
            return Task.FromResult(rows);
        }
    }

    public Task<WaferMapView?> GetWaferMapAsync(string waferId, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            WaferEntry? w = _wafers.FirstOrDefault(x => x.WaferId == waferId);
            return Task.FromResult(w is null ? null : LabRecordComposer.Map(w.WaferId, w.RunId, w.Process, w.Verdict, w.Fields, w.Specification));
        }
    }

    public Task<IReadOnlyList<RunTrendPoint>> GetRunTrendPointsAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            var points = new List<RunTrendPoint>();
            foreach (RunEntry r in _runs.OrderBy(r => r.Start))
            {
                var wafers = _wafers.Where(w => w.RunId == r.RunId).ToList();
                string? verdict = wafers.Select(w => w.Verdict).Where(v => v is not null).OrderByDescending(Rank).FirstOrDefault();
                points.Add(LabRecordComposer.TrendPoint(r.RunId, r.Chamber, r.Process, r.Start, verdict, r.LEffNm, r.TEffC, r.Excursions,
                    [.. wafers.Where(w => w.Digest is not null).Select(w => w.Digest!)]));
            }
            return Task.FromResult<IReadOnlyList<RunTrendPoint>>(points);
        }
    }

    private static int Rank(string? verdict) => verdict?.ToUpperInvariant() switch { "FAIL" => 2, "WARN" => 1, _ => 0 };
}
