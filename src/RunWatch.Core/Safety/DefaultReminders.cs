namespace RunWatch.Core.Safety;

/// <summary>
/// The reminder set used when configuration names none. Each rule reads a channel role that every chamber maps to
/// its own channel; thresholds are examples a site must set to its own chamber and procedures; the texts name the
/// usual hazards of nanowire epitaxy labs.
/// </summary>
public static class DefaultReminders
{
    /// <summary>The default rules, in display order.</summary>
    public static IReadOnlyList<ReminderRule> All { get; } =
    [
        new("substrate-above-vent-limit", "Substrate above venting limit",
            "Do not vent the chamber or open the load lock: the substrate is above the venting limit. Hot surfaces burn, " +
            "and venting hot parts damages them. Follow the site's venting procedure.",
            HazardKind.HotSurface, ReminderConditionKind.ChannelAbove, ReminderChannelRole.GrowthTemperature, 200, "°C"),
        new("arsenic-source-hot", "Arsenic source hot",
            "The arsenic source is hot. Keep the chamber closed. Arsenic deposits and arsine are highly toxic: open or " +
            "service arsenic-coated parts only under the site's procedure, with gas detection and the required protective equipment.",
            HazardKind.ToxicMaterial, ReminderConditionKind.ChannelAbove, ReminderChannelRole.ArsenicSourceTemperature, 150, "°C"),
        new("hydride-flowing", "Hydride gas flowing",
            "A hydride source gas is flowing. Leave gas lines and the cabinet closed; heed the toxic-gas monitors and " +
            "the site's gas-handling procedure.",
            HazardKind.ToxicMaterial, ReminderConditionKind.ChannelAbove, ReminderChannelRole.HydrideFlow, 0, "sccm"),
        new("run-ended-still-hot", "Run ended, substrate still hot",
            "The run has ended but the substrate and heater are still hot. Wait for cool-down before unloading or venting.",
            HazardKind.HotSurface, ReminderConditionKind.RunEndedAndChannelAbove, ReminderChannelRole.GrowthTemperature, 100, "°C", TimeSpan.FromHours(2)),
        new("cryopanel-filling", "Cryopanel being filled",
            "Liquid nitrogen is being transferred. One volume of liquid makes about 694 volumes of gas and can displace " +
            "oxygen without warning; air below 19.5 % oxygen by volume is oxygen-deficient. Keep the room ventilated, " +
            "heed the oxygen monitor, wear cryogenic gloves and face protection.",
            HazardKind.Cryogen, ReminderConditionKind.ChannelOn, ReminderChannelRole.CryopanelFill),
        new("bakeout-running", "Bake-out running",
            "The chamber is being baked: jackets, walls and viewports are hot and under thermal stress. Do not touch, " +
            "keep viewport covers on, and do not vent.",
            HazardKind.Vacuum, ReminderConditionKind.ChannelOn, ReminderChannelRole.Bakeout),
        new("electron-gun-on", "High voltage on (electron gun)",
            "The electron gun's high voltage is on. Keep covers closed; electrons striking surfaces in vacuum can produce " +
            "X-rays at viewports.",
            HazardKind.HighVoltage, ReminderConditionKind.ChannelOn, ReminderChannelRole.ElectronGunHighVoltage),
        new("telemetry-stale", "Telemetry stale",
            "No recent data from this chamber: what this page shows may be out of date. Check the chamber itself before acting.",
            HazardKind.Monitoring, ReminderConditionKind.TelemetryStale, Window: TimeSpan.FromSeconds(30)),
    ];
}
