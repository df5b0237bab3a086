namespace RunWatch.Storage;

/// <summary>Who did what, for the audit trail.</summary>
/// <param name="At">When.</param>
/// <param name="Actor">User name or <c>daemon</c>.</param>
/// <param name="Action">What was done, e.g. <c>alert-acknowledged</c>.</param>
/// <param name="Subject">What it was done to, e.g. an alert id.</param>
/// <param name="DetailJson">Further detail as JSON, may be null.</param>
public sealed record AuditEntry(DateTimeOffset At, string Actor, string Action, string? Subject, string? DetailJson);
