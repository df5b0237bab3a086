using System.Globalization;
using System.Text;
using RunWatch.Core.Geometry;

namespace RunWatch.Web.Data.Fields;

/// <summary>
/// Capture-zone outlines for the viewer (each wire's Voronoi cell ∩ its disc of radius L, Core's
/// <see cref="CaptureZones"/>) from the stored centroids over the analysed area, as SVG polygon point lists in pixels.
/// Drawn for orientation; the figures come from the stored analysis, not from this drawing.
/// </summary>
public static class ZoneOutlines
{
    /// <summary>Outline per wire id (wires outside the analysed area get none); empty when the field has no L or no area.</summary>
    public static IReadOnlyDictionary<int, string> Compute(FieldDetail field)
    {
        ArgumentNullException.ThrowIfNull(field);
        var outlines = new Dictionary<int, string>();
        double px = field.PixelSizeNm;
        if (field.DiffusionLengthNm is not > 0 || !(px > 0) || !(field.AnalysedHeightNm > 0) || field.WidthPx <= 0)
        {
            return outlines;
        }
        double width = field.WidthPx * px;
        var inside = new List<FieldWireView>(field.Wires.Count);
        var seen = new HashSet<(double, double)>();
        foreach (var w in field.Wires)
        {
            if (w.XNm >= 0 && w.XNm <= width && w.YNm >= 0 && w.YNm <= field.AnalysedHeightNm && double.IsFinite(w.XNm) && double.IsFinite(w.YNm) && seen.Add((w.XNm, w.YNm)))
            {
                inside.Add(w);
            }
        }
        if (inside.Count == 0)
        {
            return outlines;
        }
        var points = new Point2D[inside.Count];
        for (int i = 0; i < points.Length; i++)
        {
            points[i] = new Point2D(inside[i].XNm, inside[i].YNm);
        }
        CaptureZoneResult zones = CaptureZones.Compute(points, CaptureField.Rectangle(width, field.AnalysedHeightNm),
            new CaptureZoneOptions { DiffusionLength = field.DiffusionLengthNm.Value, IncludeOutlines = true, OutlineArcStepDegrees = 15 });
        var sb = new StringBuilder();
        for (int i = 0; i < points.Length; i++)
        {
            sb.Clear();
            foreach (Point2D v in zones.Outline(i))
            {
                sb.Append((v.X / px).ToString("F1", CultureInfo.InvariantCulture)).Append(',')
                  .Append((v.Y / px).ToString("F1", CultureInfo.InvariantCulture)).Append(' ');
            }
            outlines[inside[i].Id] = sb.ToString().TrimEnd();
        }
        return outlines;
    }
}
