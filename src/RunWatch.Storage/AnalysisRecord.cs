namespace RunWatch.Storage;

/// <summary>One analysis of one field. A field may be analysed again (new settings, new L); the newest counts.</summary>
public sealed record AnalysisRecord
{
    /// <summary>Store id; 0 before it is stored.</summary>
    public long Id { get; init; }

    /// <summary>The field analysed.</summary>
    public long FieldId { get; init; }

    /// <summary>When it started.</summary>
    public DateTimeOffset StartedAt { get; init; }

    /// <summary>When it finished; null while running.</summary>
    public DateTimeOffset? FinishedAt { get; init; }

    /// <summary>"done" or "failed".</summary>
    public required string Status { get; init; }

    /// <summary>Wires measured (statistics-eligible and not), when done.</summary>
    public int? WireCount { get; init; }

    /// <summary>Diffusion length used for the capture zones, nm.</summary>
    public double? DiffusionLengthNm { get; init; }

    /// <summary>Analysis settings used, as JSON.</summary>
    public string? SettingsJson { get; init; }

    /// <summary>Results as JSON (field statistics and every wire).</summary>
    public string? ResultsJson { get; init; }

    /// <summary>Why it failed.</summary>
    public string? Problem { get; init; }
}
