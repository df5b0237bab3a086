namespace RunWatch.Simulation.Demo;

/// <summary>One invented demo run: its id, wafers, growth temperature and time, its injected excursion and the seed of its simulation.</summary>
/// <param name="Run">Run id announced in the run-start event.</param>
/// <param name="Wafers">Wafer ids grown in the run.</param>
/// <param name="GrowthC">Growth setpoint, °C.</param>
/// <param name="Seed">Seed of the heater noise and the SEM fields.</param>
/// <param name="GrowthS">Growth hold (shutter open), simulated seconds.</param>
/// <param name="ExcursionHeatK">Peak injected heat of the over-temperature excursion during growth (steady-state rise, K; the controller rejects most of it); 0 injects none.</param>
public sealed record DemoRunPlan(string Run, IReadOnlyList<string> Wafers, double GrowthC, int Seed, double GrowthS = 1800, double ExcursionHeatK = 100);
