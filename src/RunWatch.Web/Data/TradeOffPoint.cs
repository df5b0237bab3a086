namespace RunWatch.Web.Data;

/// <summary>Predicted radius at one nucleation density.</summary>
public sealed record TradeOffPoint(double DensityPerSquareMicrometre, double MeanRadiusNm, double SdRadiusNm);
