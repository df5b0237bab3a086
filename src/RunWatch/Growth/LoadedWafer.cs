using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;

namespace RunWatch.Growth;

/// <summary>A case with its thermal history and its measured field, lengths in µm for the model.</summary>
/// <param name="Case">The case as read.</param>
/// <param name="Exposure">Time at each true temperature in the growth window.</param>
/// <param name="Field">The image's field without its information strip, in µm.</param>
/// <param name="CentresUm">Every object found (all act as sinks).</param>
/// <param name="PixelX">Centroid x in pixels.</param>
/// <param name="PixelY">Centroid y in pixels.</param>
/// <param name="FootprintsUm">Collecting footprint radius per object (<see cref="GrowthFootprint"/>).</param>
/// <param name="MeasuredRadiiNm">Measured radius of vertical wires clear of the edge; NaN for the rest.</param>
/// <param name="Window">Growth window on the log's axis.</param>
internal sealed record LoadedWafer(
    GrowthCase Case,
    ThermalExposure Exposure,
    CaptureField Field,
    Point2D[] CentresUm,
    double[] PixelX,
    double[] PixelY,
    double[] FootprintsUm,
    double[] MeasuredRadiiNm,
    GrowthWindow Window);
