using System.Globalization;
using System.Text;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Reporting;

/// <summary>One CSV row per wire (RFC 4180 quoting, invariant culture, lengths in the field's unit).</summary>
public static class FieldAnalysisCsv
{
    public const string Header =
        "field,id,class,touches_border,split,unit,area,equivalent_radius,centroid_x,centroid_y,min_feret,max_feret,aspect_ratio,circularity,solidity,mean_intensity,nearest_neighbour,edge_zone_area,edge_zone_norm,centroid_zone_area,centroid_zone_norm,zone_guarded";

    public static void WriteRows(TextWriter writer, FieldAnalysis analysis)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(analysis);
        var sb = new StringBuilder(256);
        string field = Core.Text.CsvCell.Text(analysis.Source);
        foreach (WireMeasurement w in analysis.Wires)
        {
            sb.Clear();
            sb.Append(field).Append(',').Append(w.Id.ToString(CultureInfo.InvariantCulture)).Append(',')
                .Append(w.Class.ToString().ToLowerInvariant()).Append(',')
                .Append(w.TouchesBorder ? "true" : "false").Append(',')
                .Append(w.Split ? "true" : "false").Append(',')
                .Append(analysis.LengthUnit);
            foreach (double? v in (double?[])[w.Area, w.EquivalentRadius, w.CentroidX, w.CentroidY, w.MinFeret, w.MaxFeret, w.AspectRatio,
                w.Circularity, w.Solidity, w.MeanIntensity, w.NearestNeighbourDistance, w.EdgeZoneArea, w.EdgeZoneNormalized,
                w.CentroidZoneArea, w.CentroidZoneNormalized])
            {
                sb.Append(',');
                if (v is { } x && double.IsFinite(x))
                {
                    sb.Append(x.ToString("G7", CultureInfo.InvariantCulture));
                }
            }
            sb.Append(',').Append(w.ZoneGuarded is { } g ? (g ? "true" : "false") : "");
            writer.WriteLine(sb.ToString());
        }
    }
}
