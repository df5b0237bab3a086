namespace RunWatch.Core.Safety;

/// <summary>
/// What a reminder watches, independent of how a chamber names its channels. Each chamber maps a role to one of its
/// own channels (in its channel configuration, or on the Settings page); a role with no channel leaves its reminder
/// "not watched on this chamber", which is shown, never silent. The names match <c>RunWatch.Storage.ChannelRole</c>.
/// </summary>
public enum ReminderChannelRole
{
    /// <summary>The rule reads no channel (telemetry staleness).</summary>
    None = 0,

    /// <summary>The substrate temperature, °C (the channel the thermal record uses).</summary>
    GrowthTemperature,

    /// <summary>The arsenic (or other group-V) source cell temperature, °C.</summary>
    ArsenicSourceTemperature,

    /// <summary>A hydride source gas flow, sccm.</summary>
    HydrideFlow,

    /// <summary>The cryopanel liquid-nitrogen fill flag or valve (on at ≥ 0.5).</summary>
    CryopanelFill,

    /// <summary>The bake-out flag (on at ≥ 0.5).</summary>
    Bakeout,

    /// <summary>The electron gun's high-voltage flag (on at ≥ 0.5).</summary>
    ElectronGunHighVoltage,
}
