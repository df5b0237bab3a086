namespace RunWatch.Simulation.Chamber;

/// <summary>One simulated sample (invented demo data).</summary>
/// <param name="TimeS">Simulated time since the run started, s.</param>
/// <param name="SubstrateTcC">Thermocouple reading, °C (channel <c>substrate_tc</c>).</param>
/// <param name="SubstrateSpC">Controller setpoint, °C (channel <c>substrate_sp</c>).</param>
/// <param name="GaShutter">Ga shutter, 1 open, 0 closed (channel <c>ga_shutter</c>).</param>
/// <param name="Step">Name of the recipe step in progress.</param>
public readonly record struct ChamberSample(double TimeS, double SubstrateTcC, double SubstrateSpC, int GaShutter, string Step);
