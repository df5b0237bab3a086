namespace RunWatch.Web.Data;

/// <summary>Who did what, when.</summary>
public sealed record AuditEntry(DateTimeOffset At, string User, string Action, string Subject, string Detail);
