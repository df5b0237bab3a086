using System.Globalization;
using System.Text;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Scale;

namespace RunWatch.Imaging.Reporting;

/// <summary>The readable summary of a field analysis (the default output of <c>runwatch analyze</c>).</summary>
public static class FieldAnalysisText
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static string Summary(FieldAnalysis a)
    {
        ArgumentNullException.ThrowIfNull(a);
        var sb = new StringBuilder();
        FieldStatistics s = a.Statistics;
        string u = a.LengthUnit;
        string scale = a.Scale.HasScale
            ? string.Create(Inv, $"pixel {a.Scale.PixelSizeNm:0.###} nm from {Describe(a.Scale.Source)}")
            : "no scale: lengths in pixels";
        Line(sb, $"{a.Source}  ({a.SourceDescription}, {a.Width} × {a.Height}, {scale})");
        if (a.WaferId is not null || a.FieldPosition is not null)
        {
            Line(sb, $"  wafer {a.WaferId ?? "?"}" + (a.FieldPosition is { } p ? string.Create(Inv, $", field at ({p.XMm:0.###}, {p.YMm:0.###}) mm") : ""));
        }
        Line(sb, $"  threshold {a.Threshold} ({a.ThresholdMethod}); excluded band {a.ExcludedBottomRows} rows ({a.ExcludedBandSource})" + (a.ExcludedTopRows > 0 ? $", strip at the top {a.ExcludedTopRows} rows (detected)" : ""));
        Line(sb, string.Create(Inv, $"  radius: {a.RadiusMethod}") + (double.IsFinite(a.EdgeSigmaPixels) ? string.Create(Inv, $"; edge blur σ {a.EdgeSigmaPixels:0.00} px, rim offset {a.EdgeOffsetPixels:+0.00;-0.00} px") : ""));
        if (a.ScaleBarPixels is { } bar)
        {
            Line(sb, string.Create(Inv, $"  scale bar in the strip: {bar} px = {a.ScaleBarLength:0.#} {u} at the configured scale (compare with the number printed on it)"));
        }
        Line(sb, $"  objects {s.ObjectsFound}: interior {s.InteriorObjects} (vertical {s.Vertical}, elongated {s.Elongated}, oversized {s.Oversized}, irregular {s.Irregular}), {s.ObjectsTouchingBorder} touching the border");
        if (s.InteriorObjects > 0)
        {
            string density = s.DensityPerUm2 is { } d
                ? string.Create(Inv, $"{d:0.###} µm⁻² = {s.DensityPerCm2:0.00e+0} cm⁻²")
                : string.Create(Inv, $"{s.DensityPerPixel2 * 1e6:0.###} per 10⁶ px²");
            Line(sb, string.Create(Inv, $"  vertical yield {100 * s.VerticalYield:0.0} %; density {density}"));
        }
        if (s.Radius is { } r)
        {
            Line(sb, string.Create(Inv,
                $"  radius of vertical wires (equivalent circle): mean {r.Mean:0.0} {u}, median {r.Median:0.0}, SD {r.StandardDeviation:0.0}, CV {100 * r.CoefficientOfVariation:0.0} %, P10–P90 {r.P10:0.0}–{r.P90:0.0} (n = {r.Count})"));
        }
        if (s.NearestNeighbourDistance is { } nn)
        {
            Line(sb, string.Create(Inv, $"  nearest neighbour: mean {nn.Mean:0.0} {u}, median {nn.Median:0.0}; Clark–Evans R {s.ClarkEvansR:0.000} (z {s.ClarkEvansZ:0.0})"));
        }
        if (s.DiffusionLength is { } l)
        {
            string length = a.Scale.HasScale ? string.Create(Inv, $"{l / 1000:0.###} µm") : string.Create(Inv, $"{l:0.#} px");
            Line(sb, string.Create(Inv,
                $"  capture zones, L = {length}: edge-based Â mean {s.EdgeZoneNormalized?.Mean:0.000} (n = {s.EdgeZoneNormalized?.Count ?? 0}), centroid-based Â mean {s.CentroidZoneNormalized?.Mean:0.000} (n = {s.CentroidZoneNormalized?.Count ?? 0})"));
        }
        if (s.WignerBeta is { } beta)
        {
            Line(sb, string.Create(Inv, $"  Voronoi cells: generalised Wigner surmise β = {beta:0.00}; suggests critical nucleus i ≈ {s.CriticalNucleus:0.0} ({s.WignerMapping}; an interpretation only)"));
        }
        foreach (string note in a.Notes)
        {
            Line(sb, "  note: " + note);
        }
        return sb.ToString();
    }

    private static string Describe(ScaleSource source) => source switch
    {
        ScaleSource.Sidecar => "sidecar",
        ScaleSource.Given => "command line",
        ScaleSource.TiffResolution => "TIFF resolution tags",
        _ => "nowhere",
    };

    private static void Line(StringBuilder sb, string text) => sb.Append(text).Append('\n');
}
