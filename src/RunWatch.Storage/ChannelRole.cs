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

    /// <summary>The arsenic (group-V) source cell temperature (°C); read by the "arsenic source hot" reminder.</summary>
    ArsenicSourceTemperature,

    /// <summary>A hydride source gas flow (sccm); read by the "hydride gas flowing" reminder.</summary>
    HydrideFlow,

    /// <summary>The cryopanel liquid-nitrogen fill flag (on at ≥ 0.5); read by the "cryopanel being filled" reminder.</summary>
    CryopanelFill,

    /// <summary>The bake-out flag (on at ≥ 0.5); read by the "bake-out running" reminder.</summary>
    Bakeout,

    /// <summary>The electron gun's high-voltage flag (on at ≥ 0.5); read by the "high voltage on" reminder.</summary>
    ElectronGunHighVoltage,
}
