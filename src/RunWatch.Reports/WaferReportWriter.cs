using System.Text;
using RunWatch.Reports.Csv;
using RunWatch.Reports.Html;
using RunWatch.Reports.Json;
using RunWatch.Reports.Model;
using RunWatch.Reports.Pdf;
using RunWatch.Reports.Rendering;

namespace RunWatch.Reports;

/// <summary>
/// Writes all four report files of a wafer into a folder: {name}.html, {name}.pdf, {name}-wires.csv and
/// {name}.json, where name is the wafer id reduced to safe file-name characters. Each file is written to a
/// temporary name first and then moved into place, so a reader never sees half a report.
/// </summary>
public static class WaferReportWriter
{
    /// <summary>Renders the charts once and writes every file.</summary>
    /// <exception cref="IOException">The folder cannot be written.</exception>
    public static ReportFiles WriteAll(WaferReport report, string directory) => WriteAll(report, directory, SafeFileName(report?.Identity.WaferId ?? ""));

    /// <summary>Renders the charts once and writes every file, named <paramref name="name"/> (already a safe file name) plus the format's ending.</summary>
    /// <exception cref="IOException">The folder cannot be written.</exception>
    public static ReportFiles WriteAll(WaferReport report, string directory, string name)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentException.ThrowIfNullOrWhiteSpace(directory);
        ArgumentException.ThrowIfNullOrWhiteSpace(name);
        Directory.CreateDirectory(directory);
        ReportChartSet charts = ReportChartSet.Render(report);
        var files = new ReportFiles(
            Path.Combine(directory, name + ".html"),
            Path.Combine(directory, name + ".pdf"),
            Path.Combine(directory, name + "-wires.csv"),
            Path.Combine(directory, name + ".json"));
        var utf8 = new UTF8Encoding(encoderShouldEmitUTF8Identifier: false);
        WriteAtomically(files.HtmlPath, s => s.Write(utf8.GetBytes(HtmlReportWriter.Write(report, charts))));
        WriteAtomically(files.PdfPath, s => PdfReportWriter.Write(report, charts, s));
        WriteAtomically(files.CsvPath, s => s.Write(utf8.GetBytes(WireCsvWriter.Write(report))));
        WriteAtomically(files.JsonPath, s => s.Write(utf8.GetBytes(JsonSummaryWriter.Write(report))));
        return files;
    }

    /// <summary>
    /// The wafer id reduced to letters, digits, '.', '-' and '_' (others become '_'; a dot only after a letter or
    /// digit), trimmed of '_' and leading dots, at most
    /// 80 characters; "wafer" when nothing is left. Keeps a hostile id from leaving the report folder.
    /// </summary>
    public static string SafeFileName(string waferId)
    {
        var sb = new StringBuilder(Math.Min(waferId?.Length ?? 0, 80));
        foreach (char c in waferId ?? "")
        {
            if (sb.Length == 80)
            {
                break;
            }
            // A dot is kept only after a letter or digit, so no ".." or leading dot survives.
            bool dotAllowed = c == '.' && sb.Length > 0 && char.IsAsciiLetterOrDigit(sb[^1]);
            sb.Append(char.IsAsciiLetterOrDigit(c) || c is '-' or '_' || dotAllowed ? c : '_');
        }
        string name = sb.ToString().Trim('_');
        return name.Length == 0 ? "wafer" : name;
    }

    private static void WriteAtomically(string path, Action<Stream> write)
    {
        string temp = path + ".tmp-" + Guid.NewGuid().ToString("N");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write))
            {
                write(stream);
            }
            File.Move(temp, path, overwrite: true);
        }
        finally
        {
            if (File.Exists(temp))
            {
                File.Delete(temp);
            }
        }
    }
}
