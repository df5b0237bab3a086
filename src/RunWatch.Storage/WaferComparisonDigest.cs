namespace RunWatch.Storage;

/// <summary>
/// After-SEM agreement of a wafer's prediction as its report summary records it (<c>comparison</c>): wires compared,
/// r², RMSE, bias (measured − predicted) and mean absolute error, in nm.
/// </summary>
public sealed record WaferComparisonDigest(int Count, double RSquared, double RmseNm, double BiasNm, double MeanAbsoluteErrorNm);
