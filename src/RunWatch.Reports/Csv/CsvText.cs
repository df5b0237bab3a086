using System.Globalization;
using System.Text;

namespace RunWatch.Reports.Csv;

/// <summary>
/// RFC 4180 cell escaping plus a guard against spreadsheet formula injection: a text cell that starts with
/// = + - @ (or a tab or carriage return) gets a leading apostrophe, so a spreadsheet shows it as text
/// (OWASP "CSV Injection" guidance, COMMON PRACTICE). Numbers written by the report are never prefixed.
/// </summary>
internal static class CsvText
{
    public static void AppendText(StringBuilder sb, string? value)
    {
        string text = value ?? "";
        if (text.Length > 0 && text[0] is '=' or '+' or '-' or '@' or '\t' or '\r')
        {
            text = "'" + text;
        }
        bool quote = text.AsSpan().IndexOfAny(",\"\r\n") >= 0 || (text.Length > 0 && (text[0] == ' ' || text[^1] == ' '));
        if (!quote)
        {
            sb.Append(text);
            return;
        }
        sb.Append('"');
        sb.Append(text.Replace("\"", "\"\"", StringComparison.Ordinal));
        sb.Append('"');
    }

    public static void AppendNumber(StringBuilder sb, double value)
    {
        if (double.IsFinite(value))
        {
            sb.Append(value.ToString("R", CultureInfo.InvariantCulture));
        }
    }
}
