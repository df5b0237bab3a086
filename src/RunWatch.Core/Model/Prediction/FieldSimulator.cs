namespace RunWatch.Core.Model.Prediction;

/// <summary>
/// Simulates one field of nucleation sites from <paramref name="seed"/> (at the process's density, with the chosen
/// site process: Poisson or hard-core), computes capture zones at the prediction's capture radius and appends the
/// normalised capture area Â of every wire that passes the guard zone to <paramref name="normalisedAreas"/>.
/// Must be deterministic in <paramref name="seed"/>.
/// </summary>
public delegate void FieldSimulator(int seed, List<double> normalisedAreas);
