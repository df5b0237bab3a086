using System.Globalization;
using System.Text;

namespace RunWatch.Reports.Csv;

/// <summary>Report CSV cells: text through the shared <see cref="Core.Text.CsvCell"/> guard, numbers round-trip.</summary>
internal static class CsvText
{
    public static void AppendText(StringBuilder sb, string? value) => Core.Text.CsvCell.AppendText(sb, value);

    public static void AppendNumber(StringBuilder sb, double value)
    {
        if (double.IsFinite(value))
        {
            sb.Append(value.ToString("R", CultureInfo.InvariantCulture));
        }
    }
}
