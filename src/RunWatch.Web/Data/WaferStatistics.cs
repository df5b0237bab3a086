namespace RunWatch.Web.Data;

/// <summary>Summary statistics of a wafer's measured wires.</summary>
public sealed record WaferStatistics(int Wires, double DensityPerSquareMicrometre, double MeanRadiusNm, double SdRadiusNm, double ClarkEvansR, double MeanNormalisedCaptureArea);
