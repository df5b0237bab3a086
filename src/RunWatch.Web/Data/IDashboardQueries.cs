namespace RunWatch.Web.Data;

/// <summary>
/// What the dashboard reads. The daemon implements it over the store; tests implement it in memory.
/// Implementations must be thread-safe (several circuits read at once) and return full-resolution samples:
/// the dashboard downsamples.
/// </summary>
public interface IDashboardQueries
{
    Task<IReadOnlyList<ChamberStatus>> GetChambersAsync(CancellationToken cancellationToken);

    Task<ChamberStatus?> GetChamberAsync(string chamber, CancellationToken cancellationToken);

    /// <summary>Samples of one channel in [from, to], ascending by time, at full resolution.</summary>
    Task<SampleSeries> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken);

    Task<IReadOnlyList<RunSummary>> GetRunsAsync(CancellationToken cancellationToken);

    Task<RunDetail?> GetRunAsync(string runId, CancellationToken cancellationToken);

    Task<WaferDetail?> GetWaferAsync(string waferId, CancellationToken cancellationToken);

    /// <summary>The field's image (PNG, JPEG or SVG), with the measurement overlay drawn or not; null if unknown.</summary>
    Task<ReportFile?> GetFieldImageAsync(string fieldId, bool overlay, CancellationToken cancellationToken);

    Task<IReadOnlyList<UnmatchedField>> GetUnmatchedFieldsAsync(CancellationToken cancellationToken);

    /// <summary>A wafer's report in the given format ("pdf", "html", "csv", "json"); null if not available.</summary>
    Task<ReportFile?> GetReportAsync(string waferId, string format, CancellationToken cancellationToken);

    /// <summary>All alerts that are active, shelved, or cleared within the history the store keeps, newest first.</summary>
    Task<IReadOnlyList<AlertView>> GetAlertsAsync(CancellationToken cancellationToken);

    Task<IReadOnlyList<string>> GetProcessesAsync(CancellationToken cancellationToken);

    Task<ProcessModelView?> GetProcessModelAsync(string process, CancellationToken cancellationToken);

    Task<IReadOnlyList<SpecEntry>> GetSpecsAsync(CancellationToken cancellationToken);

    Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxEntries, CancellationToken cancellationToken);
}
