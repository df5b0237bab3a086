namespace RunWatch.Core.Model.Diffusion;

/// <summary>A what-if for the next run: growth held at one true temperature for a time, at a nucleation density.</summary>
/// <param name="TemperatureC">Growth temperature (true, °C), held for the whole growth time.</param>
/// <param name="GrowthSeconds">Growth time (s).</param>
/// <param name="DensityPerUm2">Nucleation density (wires per µm²).</param>
/// <param name="Seed">Seed of the simulated nucleation sites: the same request gives the same answer.</param>
public sealed record GrowthPlanRequest(double TemperatureC, double GrowthSeconds, double DensityPerUm2, int Seed = 1);
