namespace RunWatch.Storage;

/// <summary>A growth run and, once closed, its thermal figures.</summary>
public sealed record RunRecord
{
    /// <summary>Store id; 0 for a run not yet stored.</summary>
    public long Id { get; init; }

    /// <summary>Chamber name.</summary>
    public required string Chamber { get; init; }

    /// <summary>Run name from the run-start event, or one the daemon made for a shutter-detected run.</summary>
    public required string Name { get; init; }

    /// <summary>How it was detected.</summary>
    public RunSource Source { get; init; }

    /// <summary>Open or closed.</summary>
    public RunStatus Status { get; init; }

    /// <summary>Why it closed; null while open.</summary>
    public RunEndReason? EndReason { get; init; }

    /// <summary>Recipe name, if announced.</summary>
    public string? Recipe { get; init; }

    /// <summary>Wafers grown in this run, if announced.</summary>
    public IReadOnlyList<string> Wafers { get; init; } = [];

    /// <summary>Announced growth setpoint, °C.</summary>
    public double? SetpointC { get; init; }

    /// <summary>Announced planned growth time, seconds.</summary>
    public double? PlannedSeconds { get; init; }

    /// <summary>Start time (UTC).</summary>
    public DateTimeOffset StartedAt { get; init; }

    /// <summary>End time (UTC); null while open.</summary>
    public DateTimeOffset? EndedAt { get; init; }

    /// <summary>Time of the last sample seen for the run's chamber while it was open.</summary>
    public DateTimeOffset? LastSampleAt { get; init; }

    /// <summary>Nominal diffusion length from setpoint and planned time, nm.</summary>
    public double? LNomNm { get; init; }

    /// <summary>Effective diffusion length from the thermal record, nm.</summary>
    public double? LEffNm { get; init; }

    /// <summary>Effective constant temperature giving the same diffusion integral, °C.</summary>
    public double? TEffC { get; init; }

    /// <summary>Fraction of the growth window covered by the record, 0..1.</summary>
    public double? Coverage { get; init; }

    /// <summary>Excursions found in the run's record; null if none computed.</summary>
    public IReadOnlyList<RunExcursionRecord>? Excursions { get; init; }

    /// <summary>Further thermal figures (window, convention factor, coverage details); null if none.</summary>
    public RunThermalSummary? Summary { get; init; }
}
