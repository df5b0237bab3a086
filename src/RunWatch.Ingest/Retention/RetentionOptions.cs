namespace RunWatch.Ingest.Retention;

/// <summary>What is kept how long, bound from the <c>Retention</c> section.</summary>
public sealed class RetentionOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Retention";

    /// <summary>Samples older than this are deleted; null keeps them for ever. <value>Default null.</value></summary>
    public TimeSpan? Samples { get; set; }

    /// <summary>Dead letters older than this are deleted (the table is also bounded by count). <value>Default 30 days.</value></summary>
    public TimeSpan DeadLetters { get; set; } = TimeSpan.FromDays(30);

    /// <summary>Alerts back to normal and unchanged for this long are deleted. <value>Default 365 days.</value></summary>
    public TimeSpan NormalAlerts { get; set; } = TimeSpan.FromDays(365);

    /// <summary>How often old rows are pruned. <value>Default 1 h.</value></summary>
    public TimeSpan PruneInterval { get; set; } = TimeSpan.FromHours(1);

    /// <summary>How often idle housekeeping (WAL checkpoint) is tried. <value>Default 1 s.</value></summary>
    public TimeSpan MaintenanceInterval { get; set; } = TimeSpan.FromSeconds(1);
}
