namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// A stored process diffusion model: the fitted <see cref="DiffusionRadiusModel"/> and the process's wire density,
/// which the run-end estimate needs before any image of the run exists (<see cref="RunEndEstimator"/>).
/// </summary>
/// <param name="Model">The fitted model.</param>
/// <param name="WireDensityPerUm2">Wire density of the process (per µm²), e.g. the mean of the calibration wafers.</param>
public sealed record DiffusionModelParams(DiffusionRadiusModel Model, double WireDensityPerUm2);
