namespace RunWatch.Web.Data;

/// <summary>One measured wire: radius, normalised capture area Â = A/(π·L²) and the radius the model predicts for it.</summary>
public sealed record WireMeasurement(double RadiusNm, double NormalisedCaptureArea, double PredictedRadiusNm);
