namespace RunWatch.Simulation.Demo;

/// <summary>One invented demo run: its id, wafers, growth temperature and the seed of its simulation.</summary>
/// <param name="Run">Run id announced in the run-start event.</param>
/// <param name="Wafers">Wafer ids grown in the run.</param>
/// <param name="GrowthC">Growth setpoint, °C.</param>
/// <param name="Seed">Seed of the heater noise and the SEM fields.</param>
public sealed record DemoRunPlan(string Run, IReadOnlyList<string> Wafers, double GrowthC, int Seed);
