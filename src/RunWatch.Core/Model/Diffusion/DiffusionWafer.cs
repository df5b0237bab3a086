namespace RunWatch.Core.Model.Diffusion;

/// <summary>One calibration or prediction wafer: its field's capture table, its growth history and its measured radii.</summary>
/// <param name="Id">Wafer id.</param>
/// <param name="Table">Capture areas of the measured field over λ.</param>
/// <param name="Exposure">Time at each true temperature during the growth window.</param>
/// <param name="MeasuredRadiiNm">Measured radius per wire in table order (NaN where not measured).</param>
public sealed record DiffusionWafer(string Id, CaptureAreaTable Table, ThermalExposure Exposure, double[] MeasuredRadiiNm);
