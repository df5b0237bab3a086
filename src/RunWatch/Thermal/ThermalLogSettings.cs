using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>What <c>runwatch thermal</c> was asked to compute.</summary>
internal sealed record ThermalLogSettings
{
    /// <summary>Channel to analyse; null picks the first channel of the file.</summary>
    public string? Channel { get; init; }

    /// <summary>Window start as written by the user (seconds or ISO-8601); null for the first sample.</summary>
    public string? From { get; init; }

    /// <summary>Window end as written by the user; null for the last sample.</summary>
    public string? To { get; init; }

    /// <summary>Recipe setpoint on the instrument's scale, °C.</summary>
    public double? SetpointC { get; init; }

    /// <summary>Column holding the setpoint per row (carried forward over empty cells).</summary>
    public string? SetpointChannel { get; init; }

    /// <summary>Planned growth duration, s; defaults to the window length when a setpoint is known.</summary>
    public double? PlannedS { get; init; }

    public required ArrheniusDiffusivity Diffusivity { get; init; }

    /// <summary>True when the diffusivity is the built-in example rather than the user's process.</summary>
    public bool DiffusivityIsExample { get; init; }

    public required TemperatureCalibration Calibration { get; init; }

    public required DiffusionLengthOptions Length { get; init; }

    public required ExcursionOptions Excursions { get; init; }
}
