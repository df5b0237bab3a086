namespace RunWatch.Storage;

/// <summary>
/// What the diffusion radius model made of a wafer (part of <see cref="WaferReportDigest"/>): the model record used,
/// λ at the wafer's mean growth temperature, λ_eff over its real history, and how many wires it could predict.
/// Lengths in nm. Null in the digest when the diffusion model was not applied (the verdict's radius-model rule says why).
/// </summary>
/// <param name="ModelFitId">The accepted diffusion model record used.</param>
/// <param name="Method">Where capture areas came from: <c>Diffusion</c> or <c>VoronoiDisc</c>.</param>
/// <param name="MeanTemperatureC">Time-weighted mean true growth temperature.</param>
/// <param name="CoveredS">Growth seconds covered by the run's record.</param>
/// <param name="LambdaAtMeanNm">λ at the mean temperature.</param>
/// <param name="LambdaEffNm">λ_eff: the constant λ that collects what the real history collected (null when it could not be found).</param>
/// <param name="LambdaMinNm">Smallest λ the history reached.</param>
/// <param name="LambdaMaxNm">Largest λ the history reached.</param>
/// <param name="PredictedWires">Measured wires with a prediction.</param>
/// <param name="GuardedWires">Measured wires near the field edges left without one.</param>
/// <param name="Extrapolated">The wafer lies outside the model's calibrated temperature or time range.</param>
public sealed record WaferDiffusionDigest(long ModelFitId, string Method, double MeanTemperatureC, double CoveredS, double LambdaAtMeanNm, double? LambdaEffNm,
    double LambdaMinNm, double LambdaMaxNm, int PredictedWires, int GuardedWires, bool Extrapolated);
