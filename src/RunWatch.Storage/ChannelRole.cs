namespace RunWatch.Storage;

/// <summary>What a channel means to the daemon. Stored as its name.</summary>
public enum ChannelRole
{
    /// <summary>Any other reading; recorded, not interpreted.</summary>
    Other = 0,

    /// <summary>The substrate temperature reading used for the thermal record (°C after calibration).</summary>
    GrowthTemperature,

    /// <summary>The controller's temperature setpoint (°C).</summary>
    Setpoint,

    /// <summary>The shutter that opens and closes the growth window (open when at or above the chamber's threshold).</summary>
    GrowthShutter,
}
