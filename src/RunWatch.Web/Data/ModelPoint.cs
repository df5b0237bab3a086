namespace RunWatch.Web.Data;

/// <summary>One point of radius data: a wire's normalised capture area and measured radius.</summary>
public sealed record ModelPoint(double NormalisedCaptureArea, double RadiusNm, string WaferId);
