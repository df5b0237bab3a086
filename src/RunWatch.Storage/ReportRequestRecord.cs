namespace RunWatch.Storage;

/// <summary>A request for a wafer's next report revision, kept until a revision answers it.</summary>
/// <param name="Id">Store id; 0 before it is stored.</param>
/// <param name="Wafer">Wafer name.</param>
/// <param name="RequestedAt">When it was asked.</param>
/// <param name="Requester">A dashboard user, or "intake" for a new field of an issued wafer.</param>
/// <param name="Reason">Why, in words.</param>
public sealed record ReportRequestRecord(long Id, string Wafer, DateTimeOffset RequestedAt, string Requester, string Reason);
