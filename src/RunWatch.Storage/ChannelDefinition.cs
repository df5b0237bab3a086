namespace RunWatch.Storage;

/// <summary>A channel of a chamber as configured.</summary>
/// <param name="Name">Channel name as it appears in telemetry (case-sensitive).</param>
/// <param name="Role">What the daemon does with it.</param>
/// <param name="Unit">Unit of the published value, e.g. <c>degC</c>.</param>
/// <param name="MinValue">Lowest physically possible reading; lower values are rejected. Null for no bound.</param>
/// <param name="MaxValue">Highest physically possible reading; higher values are rejected. Null for no bound.</param>
/// <param name="Calibration">Reference points mapping readings to true values (may be empty).</param>
public sealed record ChannelDefinition(
    string Name,
    ChannelRole Role,
    string Unit,
    double? MinValue,
    double? MaxValue,
    IReadOnlyList<CalibrationPoint> Calibration);
