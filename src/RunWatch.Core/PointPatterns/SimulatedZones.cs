namespace RunWatch.Core.PointPatterns;

/// <summary>Capture zones of one simulated site pattern in a periodic box (no edge, so every zone counts).</summary>
/// <param name="Areas">Zone areas (length unit²).</param>
/// <param name="NormalisedAreas">Â = A/(πL²); NaN for L = ∞.</param>
/// <param name="SiteCount">Sites simulated.</param>
/// <param name="Density">Achieved density (sites / box area).</param>
/// <param name="BoxSide">Side of the periodic square box (length unit).</param>
/// <param name="ReachedTarget">False when random sequential adsorption stopped short of the density.</param>
public sealed record SimulatedZones(double[] Areas, double[] NormalisedAreas, int SiteCount, double Density, double BoxSide, bool ReachedTarget);
