using RunWatch.Core.Excursions;
using RunWatch.Core.Runs;
using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>Everything <c>runwatch thermal</c> prints, computed from one log.</summary>
internal sealed record ThermalLogReport
{
    public required string Channel { get; init; }

    public required int SampleCount { get; init; }

    public required DateTimeOffset? Origin { get; init; }

    public required DiffusionLengthResult Length { get; init; }

    public required ThermalLogSettings Settings { get; init; }

    /// <summary>Setpoint used for the band checks, when one was known.</summary>
    public required string? SetpointSource { get; init; }

    /// <summary>Every excursion of the log, each marked in or outside the growth window, with its effect on L_eff.</summary>
    public required IReadOnlyList<RunExcursionEffect> Excursions { get; init; }

    /// <summary>Alarms other than the deviation bands that became active (limits, rate, flatline).</summary>
    public required IReadOnlyList<AlarmTransition> OtherAlarms { get; init; }

    /// <summary>Things the reader should know (defaults used, assumptions).</summary>
    public required IReadOnlyList<string> Notes { get; init; }
}
