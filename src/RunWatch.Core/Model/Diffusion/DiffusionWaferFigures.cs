namespace RunWatch.Core.Model.Diffusion;

/// <summary>How the model fits one wafer.</summary>
/// <param name="Id">Wafer id.</param>
/// <param name="WiresUsed">Unguarded wires with a measured radius.</param>
/// <param name="MeanTemperatureC">Time-weighted mean true temperature of the growth window.</param>
/// <param name="WindowS">Growth window length.</param>
/// <param name="LambdaAtMeanUm">λ at the mean temperature.</param>
/// <param name="LambdaEffUm">λ_eff over the real history (NaN outside the table).</param>
/// <param name="MeanMeasuredNm">Mean measured radius of the wires used.</param>
/// <param name="MeanPredictedNm">Mean predicted radius of the same wires.</param>
/// <param name="BiasNm">mean(predicted − measured).</param>
/// <param name="RmseNm">Root mean square of predicted − measured.</param>
/// <param name="MedianLogSlope">Median d ln A / d ln λ at λ_eff: near 0 every wire is held by its neighbours (Voronoi-limited) and the radii say nothing about λ.</param>
public sealed record DiffusionWaferFigures(
    string Id,
    int WiresUsed,
    double MeanTemperatureC,
    double WindowS,
    double LambdaAtMeanUm,
    double LambdaEffUm,
    double MeanMeasuredNm,
    double MeanPredictedNm,
    double BiasNm,
    double RmseNm,
    double MedianLogSlope);
