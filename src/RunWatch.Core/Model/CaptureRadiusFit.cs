namespace RunWatch.Core.Model;

/// <summary>The capture radius that best explains one wafer's measured radii.</summary>
/// <param name="CaptureRadiusNm">The L maximising r² of the model.</param>
/// <param name="Fit">The model fitted at that L.</param>
/// <param name="Scan">The coarse scan, in increasing L, then the golden-section evaluations.</param>
/// <param name="AtSearchEdge">True when the best L is the first or last scan point: the optimum may lie outside the range.</param>
public sealed record CaptureRadiusFit(double CaptureRadiusNm, RadiusModelFit Fit, IReadOnlyList<CaptureRadiusScanPoint> Scan, bool AtSearchEdge);
