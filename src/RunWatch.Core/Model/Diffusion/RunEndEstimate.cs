namespace RunWatch.Core.Model.Diffusion;

/// <summary>What the accepted diffusion model expects of a run at its end, before any SEM image exists.</summary>
/// <param name="LambdaAtSetpointUm">λ at the run's setpoint (true temperature).</param>
/// <param name="LambdaEffUm">λ_eff over the run's real growth history (see <see cref="EffectiveCaptureLength"/>).</param>
/// <param name="MeanRadiusNm">Expected mean wire radius.</param>
/// <param name="RadiusSdNm">Wire-to-wire SD of the expected radius (site geometry only; model scatter not added).</param>
/// <param name="WireCount">Simulated wires.</param>
/// <param name="Excursions">Each excursion's effect on the expected mean radius (nm) and on λ_eff.</param>
/// <param name="Extrapolated">The run lies outside the model's calibrated temperature or time range.</param>
public sealed record RunEndEstimate(
    double LambdaAtSetpointUm,
    double LambdaEffUm,
    double MeanRadiusNm,
    double RadiusSdNm,
    int WireCount,
    IReadOnlyList<ExcursionRadiusEffect> Excursions,
    bool Extrapolated);
