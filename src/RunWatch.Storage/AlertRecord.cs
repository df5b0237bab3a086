namespace RunWatch.Storage;

/// <summary>An alert and where it is in its lifecycle.</summary>
public sealed record AlertRecord
{
    /// <summary>Store id; 0 for an alert not yet stored.</summary>
    public long Id { get; init; }

    /// <summary>Identity of the condition (e.g. <c>excursion-high/C1</c>): at most one alert per key is not normal.</summary>
    public required string Key { get; init; }

    /// <summary>Chamber name; null for daemon-wide alerts (e.g. the store cannot be written).</summary>
    public string? Chamber { get; init; }

    /// <summary>Run the alert belongs to, if any.</summary>
    public long? RunId { get; init; }

    /// <summary>Kind, e.g. <c>excursion-high</c>, <c>excursion-low</c>, <c>stale-telemetry</c>, <c>store-unwritable</c>.</summary>
    public required string Kind { get; init; }

    /// <summary>Severity.</summary>
    public AlertSeverity Severity { get; init; }

    /// <summary>Lifecycle state.</summary>
    public AlertState State { get; init; }

    /// <summary>One line for people.</summary>
    public required string Message { get; init; }

    /// <summary>When the condition began.</summary>
    public DateTimeOffset RaisedAt { get; init; }

    /// <summary>When an operator acknowledged it.</summary>
    public DateTimeOffset? AcknowledgedAt { get; init; }

    /// <summary>Who acknowledged it.</summary>
    public string? AcknowledgedBy { get; init; }

    /// <summary>When the condition ended.</summary>
    public DateTimeOffset? ClearedAt { get; init; }

    /// <summary>Last change of any field.</summary>
    public DateTimeOffset UpdatedAt { get; init; }

    /// <summary>Worst value seen while active (e.g. the largest deviation in K), if meaningful.</summary>
    public double? PeakValue { get; init; }

    /// <summary>Further detail as JSON, may be null.</summary>
    public string? DetailJson { get; init; }
}
