namespace RunWatch.Storage;

/// <summary>
/// Report revisions and the requests that lead to them. Implemented by the SQLite and PostgreSQL stores. Thread-safe.
/// </summary>
public interface IReportRevisionStore
{
    /// <summary>Records that <paramref name="request"/>'s wafer needs a new revision (re-analysis, new field).</summary>
    Task<ReportRequestRecord> AddReportRequestAsync(ReportRequestRecord request, CancellationToken cancellationToken);

    /// <summary>Requests of a wafer no revision has answered yet, oldest first.</summary>
    Task<IReadOnlyList<ReportRequestRecord>> GetPendingReportRequestsAsync(string wafer, CancellationToken cancellationToken);

    /// <summary>
    /// Stores a revision and marks the listed requests answered by it, in one transaction. Returns null (and stores
    /// nothing) when the wafer already has a revision of that number: another writer got there first.
    /// </summary>
    Task<ReportRevisionRecord?> AddReportRevisionAsync(ReportRevisionRecord revision, IReadOnlyList<long> answeredRequestIds, CancellationToken cancellationToken);

    /// <summary>Revisions of a wafer, oldest (revision 1) first.</summary>
    Task<IReadOnlyList<ReportRevisionRecord>> GetReportRevisionsAsync(string wafer, CancellationToken cancellationToken);

    /// <summary>The revision whose content hash is <paramref name="contentSha256"/>, or null.</summary>
    Task<ReportRevisionRecord?> FindReportRevisionAsync(string contentSha256, CancellationToken cancellationToken);
}
