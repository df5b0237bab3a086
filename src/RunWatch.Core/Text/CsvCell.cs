using System.Text;

namespace RunWatch.Core.Text;

/// <summary>
/// The one CSV cell writer of every CSV RunWatch writes (reports and <c>runwatch analyze --csv</c>): RFC 4180
/// quoting plus a guard against spreadsheet formula injection. A text cell that starts with = + - @ (or a tab or a
/// carriage return) gets a leading apostrophe, so a spreadsheet shows it as text (OWASP "CSV Injection" guidance,
/// COMMON PRACTICE). Numbers are written by the callers and never prefixed.
/// </summary>
public static class CsvCell
{
    /// <summary>Appends <paramref name="value"/> as one text cell (null = empty).</summary>
    public static void AppendText(StringBuilder sb, string? value)
    {
        ArgumentNullException.ThrowIfNull(sb);
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

    /// <summary>The text cell for <paramref name="value"/> as a string.</summary>
    public static string Text(string? value)
    {
        var sb = new StringBuilder((value?.Length ?? 0) + 4);
        AppendText(sb, value);
        return sb.ToString();
    }
}
