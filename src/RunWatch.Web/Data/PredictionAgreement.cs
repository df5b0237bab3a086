namespace RunWatch.Web.Data;

/// <summary>How well the before-SEM prediction agreed with the measured radii of a wafer (from its report).</summary>
public sealed record PredictionAgreement(int Count, double BiasNm, double RmseNm, double RSquared, double MeanAbsoluteErrorNm);
