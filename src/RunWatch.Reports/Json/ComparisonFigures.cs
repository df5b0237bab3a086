namespace RunWatch.Reports.Json;

/// <summary>After-SEM agreement figures of a report summary.</summary>
public sealed record ComparisonFigures(int Count, double RSquared, double RmseNm, double BiasNm, double MeanAbsoluteErrorNm);
