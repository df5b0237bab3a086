namespace RunWatch.Core.Model;

/// <summary>One wafer's best-fit capture radius as recorded in a calibration.</summary>
/// <param name="WaferId">Wafer.</param>
/// <param name="CaptureRadiusNm">Best-fit L (nm).</param>
/// <param name="RSquared">r² of the search model at that L.</param>
/// <param name="AtSearchEdge">True when L sits at the end of the searched range (not located; left out of the Arrhenius fit).</param>
/// <param name="WireCount">Wires with a usable Â at that L.</param>
public sealed record WaferCaptureRadius(string WaferId, double CaptureRadiusNm, double RSquared, bool AtSearchEdge, int WireCount);
