namespace RunWatch.Core.Model;

/// <summary>
/// Computes each wire's normalised capture area Â = area / (π·L²) at capture radius <paramref name="captureRadiusNm"/>
/// into <paramref name="normalisedAreas"/> (one slot per wire, always in the same wire order). Write NaN for a wire
/// that is left out at this L (for example its disc crosses the field edge).
/// </summary>
public delegate void CaptureAreaEvaluator(double captureRadiusNm, Span<double> normalisedAreas);
