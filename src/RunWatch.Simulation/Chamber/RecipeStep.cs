namespace RunWatch.Simulation.Chamber;

/// <summary>One step of a demo recipe: ramp the setpoint to <paramref name="TargetC"/> at <paramref name="RampKPerS"/>, then hold.</summary>
/// <param name="Name">Step name as published in step events.</param>
/// <param name="TargetC">Setpoint at the end of the ramp, °C.</param>
/// <param name="RampKPerS">Setpoint ramp rate, K/s (positive).</param>
/// <param name="HoldS">Time held at the target after the ramp, s.</param>
/// <param name="GaShutterOpen">Whether the Ga shutter is open during this step.</param>
public sealed record RecipeStep(string Name, double TargetC, double RampKPerS, double HoldS, bool GaShutterOpen);
