namespace RunWatch.Storage;

/// <summary>
/// What the process's accepted diffusion radius model expects of a closed run (Core <c>RunEndEstimator</c>): the
/// capture length λ at the setpoint, λ_eff over the real history, the expected mean radius, and each excursion's
/// effect on it in nm. Null figures could not be computed; <see cref="Error"/> says why.
/// </summary>
/// <param name="ModelFitId">The accepted model record used.</param>
/// <param name="LambdaAtSetpointNm">λ at the run's setpoint (true temperature), nm.</param>
/// <param name="LambdaEffNm">λ_eff: the constant capture length that collects the same as the real history, nm.</param>
/// <param name="MeanRadiusNm">Expected mean wire radius, nm.</param>
/// <param name="RadiusSdNm">Wire-to-wire SD of the expected radius from site geometry, nm.</param>
/// <param name="Extrapolated">The run lies outside the model's calibrated temperature or time range.</param>
/// <param name="Excursions">Each excursion's effect on the expected mean radius.</param>
/// <param name="Error">Why the figures are missing, or null.</param>
public sealed record RunDiffusionFigures(long ModelFitId, double? LambdaAtSetpointNm, double? LambdaEffNm, double? MeanRadiusNm, double? RadiusSdNm,
    bool Extrapolated, IReadOnlyList<RunExcursionRadiusChange> Excursions, string? Error);
