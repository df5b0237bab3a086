namespace RunWatch.Core.Model.Prediction;

/// <summary>Per-wafer agreement of predicted (from each wire's measured Â) and measured radii.</summary>
/// <param name="PredictedNm">Predicted radius per wire, in input order (NaN where Â was not available).</param>
/// <param name="Count">Wires compared.</param>
/// <param name="RSquared">1 − Σ(m − p)²/Σ(m − m̄)²: the share of the measured spread the prediction explains; negative when the prediction is worse than the measured mean.</param>
/// <param name="RmseNm">√(mean (p − m)²).</param>
/// <param name="BiasNm">mean(p − m): positive when the model predicts too large.</param>
/// <param name="MeanAbsoluteErrorNm">mean |p − m|.</param>
public sealed record PredictedVsMeasured(IReadOnlyList<double> PredictedNm, int Count, double RSquared, double RmseNm, double BiasNm, double MeanAbsoluteErrorNm);
