namespace RunWatch.Web.Data;

/// <summary>Predicted wire radius distribution for a run (before SEM), in nm.</summary>
public sealed record RadiusPrediction(double MeanNm, double SdNm, double P05Nm, double P95Nm);
