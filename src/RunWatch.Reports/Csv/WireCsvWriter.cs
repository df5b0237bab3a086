using System.Globalization;
using System.Text;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;

namespace RunWatch.Reports.Csv;

/// <summary>Writes every wire of a report as CSV (UTF-8, comma, CRLF line ends as RFC 4180 asks, header row).</summary>
public static class WireCsvWriter
{
    /// <summary>The header row's column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
        ["wafer_id", "field", "wire", "x_nm", "y_nm", "radius_nm", "normalised_area", "predicted_radius_nm", "vertical"];

    /// <summary>Formats the CSV. Empty cells stand for values that are not available (NaN).</summary>
    public static string Write(WaferReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        var sb = new StringBuilder(64 * (report.Wires.Count + 1));
        sb.Append(string.Join(',', Columns)).Append("\r\n");
        foreach (WireRow w in report.Wires)
        {
            CsvText.AppendText(sb, report.Identity.WaferId);
            sb.Append(',');
            CsvText.AppendText(sb, w.FieldName);
            sb.Append(',');
            sb.Append(w.WireId.ToString(CultureInfo.InvariantCulture));
            sb.Append(',');
            CsvText.AppendNumber(sb, w.XNm);
            sb.Append(',');
            CsvText.AppendNumber(sb, w.YNm);
            sb.Append(',');
            CsvText.AppendNumber(sb, w.RadiusNm);
            sb.Append(',');
            CsvText.AppendNumber(sb, w.NormalisedArea);
            sb.Append(',');
            CsvText.AppendNumber(sb, w.PredictedRadiusNm);
            sb.Append(',');
            sb.Append(w.Vertical ? "true" : "false");
            sb.Append("\r\n");
        }
        return sb.ToString();
    }
}
