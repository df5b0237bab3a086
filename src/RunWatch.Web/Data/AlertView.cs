namespace RunWatch.Web.Data;

/// <summary>An alert and its ISA-18.2 state; <c>WasSuppressed</c>: recorded while suppressed by design and never raised.</summary>
public sealed record AlertView(string AlertId, string Chamber, string? RunId, string Message, AlertSeverity Severity, AlertState State, DateTimeOffset RaisedAt, DateTimeOffset? ClearedAt, string? AcknowledgedBy, string? Comment, DateTimeOffset? ShelvedUntil, string? ShelvedBy,
    bool WasSuppressed = false);
