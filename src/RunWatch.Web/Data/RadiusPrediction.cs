namespace RunWatch.Web.Data;

/// <summary>Predicted wire radius distribution for a run (before SEM), in nm.</summary>
public sealed record RadiusPrediction(double MeanNm, double SdNm, double P10Nm, double P90Nm);
