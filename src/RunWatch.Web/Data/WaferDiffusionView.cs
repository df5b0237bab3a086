namespace RunWatch.Web.Data;

/// <summary>What the diffusion radius model made of a wafer (from its report's digest): λ, λ_eff and coverage. Lengths in nm.</summary>
/// <param name="ModelRecordId">The accepted model record used.</param>
/// <param name="Method">Capture areas from the diffusion solution (<c>Diffusion</c>) or Voronoi ∩ disc (<c>VoronoiDisc</c>).</param>
/// <param name="MeanTemperatureC">Time-weighted mean true growth temperature.</param>
/// <param name="CoveredS">Growth seconds covered by the record.</param>
/// <param name="LambdaAtMeanNm">λ at that temperature.</param>
/// <param name="LambdaEffNm">λ_eff over the real history (NaN when not found).</param>
/// <param name="LambdaMinNm">Smallest λ of the history.</param>
/// <param name="LambdaMaxNm">Largest λ of the history.</param>
/// <param name="PredictedWires">Wires with a prediction.</param>
/// <param name="GuardedWires">Measured wires near the field edges left without one.</param>
/// <param name="Extrapolated">Outside the model's calibrated temperature or time range.</param>
public sealed record WaferDiffusionView(long ModelRecordId, string Method, double MeanTemperatureC, double CoveredS, double LambdaAtMeanNm, double LambdaEffNm,
    double LambdaMinNm, double LambdaMaxNm, int PredictedWires, int GuardedWires, bool Extrapolated);
