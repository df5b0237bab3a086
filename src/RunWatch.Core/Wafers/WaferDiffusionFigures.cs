using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Core.Wafers;

/// <summary>What the diffusion radius model made of one wafer over its run's real thermal history.</summary>
/// <param name="Method">Where the capture areas came from (diffusion solution or Voronoi ∩ disc).</param>
/// <param name="MeanTemperatureC">Time-weighted mean true growth temperature of the covered window.</param>
/// <param name="CoveredS">Growth seconds covered by the record.</param>
/// <param name="LambdaAtMeanUm">λ at the mean temperature.</param>
/// <param name="LambdaEffUm">λ_eff over the real history (see <see cref="EffectiveCaptureLength"/>), over every field; NaN when no wire is unguarded.</param>
/// <param name="LambdaMinUm">Smallest λ the history reached.</param>
/// <param name="LambdaMaxUm">Largest λ the history reached.</param>
/// <param name="PredictedWires">Counted wires with a prediction (unguarded).</param>
/// <param name="GuardedWires">Counted wires left out because their collection depends on what lies outside the image.</param>
/// <param name="Extrapolated">The wafer's temperature or growth time lies outside the model's calibrated range.</param>
public sealed record WaferDiffusionFigures(
    CaptureAreaMethod Method,
    double MeanTemperatureC,
    double CoveredS,
    double LambdaAtMeanUm,
    double LambdaEffUm,
    double LambdaMinUm,
    double LambdaMaxUm,
    int PredictedWires,
    int GuardedWires,
    bool Extrapolated);
