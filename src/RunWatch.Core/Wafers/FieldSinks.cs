using RunWatch.Core.Geometry;
using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Core.Wafers;

/// <summary>
/// One stored field as the diffusion model sees it, lengths in µm: every object found is a sink (a wire or a crystallite
/// collects adatoms whether or not it is measured), with the collecting footprint of <see cref="GrowthFootprint"/>; a
/// measured radius only where the wire counts (<see cref="WaferEvaluator.Counts"/>).
/// </summary>
/// <param name="Field">The analysed rectangle (image without its information strip).</param>
/// <param name="CentresUm">Sink centres.</param>
/// <param name="FootprintsUm">Collecting footprint radius per sink.</param>
/// <param name="MeasuredRadiiNm">Measured radius of counted wires, NaN for the rest.</param>
/// <param name="WireIndex">Index of each sink in <see cref="FieldResult.Wires"/>.</param>
public sealed record FieldSinks(CaptureField Field, Point2D[] CentresUm, double[] FootprintsUm, double[] MeasuredRadiiNm, int[] WireIndex)
{
    /// <summary>Footprint of an object with neither a wire nor a droplet radius (nm): a typical small wire, invented.</summary>
    public const double FallbackRadiusNm = 30;

    /// <summary>The sinks of <paramref name="field"/>; objects outside the analysed rectangle are left out.</summary>
    public static FieldSinks From(FieldResult field)
    {
        ArgumentNullException.ThrowIfNull(field);
        double widthUm = field.WidthNm / 1000, heightUm = field.AnalysedHeightNm / 1000;
        var centres = new List<Point2D>(field.Wires.Count);
        var footprints = new List<double>(field.Wires.Count);
        var measured = new List<double>(field.Wires.Count);
        var index = new List<int>(field.Wires.Count);
        for (int i = 0; i < field.Wires.Count; i++)
        {
            FieldWire w = field.Wires[i];
            double x = w.XNm / 1000, y = w.YNm / 1000;
            if (!(x >= 0 && y >= 0 && x <= widthUm && y <= heightUm))
            {
                continue;
            }
            double radius = double.IsFinite(w.RadiusNm) && w.RadiusNm > 0 ? w.RadiusNm
                : w.DropletRadiusNm is { } d && double.IsFinite(d) && d > 0 ? d : FallbackRadiusNm;
            centres.Add(new Point2D(x, y));
            footprints.Add(GrowthFootprint.FootprintUm(radius));
            measured.Add(WaferEvaluator.Counts(w) ? w.RadiusNm : double.NaN);
            index.Add(i);
        }
        return new FieldSinks(CaptureField.Rectangle(widthUm, heightUm), centres.ToArray(), footprints.ToArray(), measured.ToArray(), index.ToArray());
    }

    /// <summary>Objects per µm² of the analysed rectangle.</summary>
    public double DensityPerUm2 => CentresUm.Length / (Field.Width * Field.Height);
}
