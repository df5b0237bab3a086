namespace RunWatch.Core.Model;

/// <summary>One evaluated capture radius in a best-fit search.</summary>
/// <param name="CaptureRadiusNm">L (nm).</param>
/// <param name="RSquared">r² of the model at this L (NaN when too few wires were usable).</param>
/// <param name="WireCount">Wires with a finite Â at this L.</param>
public readonly record struct CaptureRadiusScanPoint(double CaptureRadiusNm, double RSquared, int WireCount);
