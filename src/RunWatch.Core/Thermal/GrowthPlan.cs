namespace RunWatch.Core.Thermal;

/// <summary>What the recipe planned for the growth window.</summary>
/// <param name="SetpointC">Substrate setpoint in °C.</param>
/// <param name="PlannedS">Planned growth duration in s.</param>
public readonly record struct GrowthPlan(double SetpointC, double PlannedS);
