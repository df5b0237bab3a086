using System.Text.RegularExpressions;
using RunWatch.Core.Qc;
using RunWatch.Reports.Pdf;
using RunWatch.Reports.Tests.Support;
using RunWatch.Testing.Documents;
using Xunit;

namespace RunWatch.Reports.Tests.Pdf;

/// <summary>
/// The report's layout fixes, read back with poppler's pdftotext (a PDF reader outside the project): rule names are
/// printed whole, radii to 0.1 nm, the prediction summary is on page 1, and times follow the dashboard's clock
/// (lab-local with the UTC offset).
/// </summary>
public sealed partial class ReportLayoutFixTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("rw-report-fix-").FullName;

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void Pdf_EveryRuleDescription_PrintedWholeWithoutEllipsis()
    {
        var report = SampleReport.Build();
        string pdf = Write(report);

        // -raw keeps the order the text was drawn in: a wrapped cell's lines follow one another.
        string raw = Fold(PopplerText.Run("pdftotext", "-raw", "-enc", "UTF-8", pdf, "-"));

        Assert.NotEmpty(report.Verdict.Rules);
        foreach (QcRuleResult rule in report.Verdict.Rules)
        {
            Assert.Contains(Fold(rule.Description), raw, StringComparison.Ordinal);
        }
        // The only ellipsis left is the range notation of limits ("5e+7 … 5e+8"), never one glued to a cut word.
        Assert.Empty(CutWord().Matches(raw));
    }

    [Fact]
    public void Pdf_FirstPage_HoldsThePredictionSummaryWithRadiiToOneTenthNm()
    {
        var report = SampleReport.Build();
        string pdf = Write(report);

        string page1 = Fold(PopplerText.Run("pdftotext", "-raw", "-f", "1", "-l", "1", "-enc", "UTF-8", pdf, "-"));

        Assert.Contains("Prediction summary", page1, StringComparison.Ordinal);
        Assert.Contains("Predicted before SEM " + report.Prediction!.MeanRadiusNm.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + " nm", page1, StringComparison.Ordinal);
        Assert.Contains("Measured mean radius " + report.Statistics.MeanRadiusNm.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + " nm", page1, StringComparison.Ordinal);
        Assert.Contains("RMSE " + report.Comparison!.RmseNm.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + " nm", page1, StringComparison.Ordinal);
        // Every length in nm on the whole report has one decimal at most (none for positions and L); the model's formula
        // ("r = 59.063·Â^0.485 nm") is an expression, not a length, and is left as the model writes it.
        string all = PopplerText.Text(pdf);
        Assert.Empty(NmWithTwoOrMoreDecimals().Matches(all));
    }

    [Fact]
    public void Pdf_Times_LabLocalWithOffset()
    {
        // Asia/Kolkata is UTC+05:30 all year (no daylight saving since 1945; FROM MEMORY, stable tz database entry).
        var report = SampleReport.Build();
        report = report with { Identity = report.Identity with { TimeZoneId = "Asia/Kolkata" } };
        string text = Fold(PopplerText.Run("pdftotext", "-raw", "-enc", "UTF-8", Write(report), "-"));

        // Report written 2026-03-06 14:30:00 UTC → 20:00:00 at +05:30.
        Assert.Contains("Report written 2026-03-06 20:00:00 UTC+05:30", text, StringComparison.Ordinal);
        Assert.Contains("Run start 2026-03-04 14:30:00 UTC+05:30", text, StringComparison.Ordinal);
        Assert.Contains("Times are the lab's local time (Asia/Kolkata) with their offset from UTC", text, StringComparison.Ordinal);
    }

    private string Write(RunWatch.Reports.Model.WaferReport report)
    {
        string path = Path.Combine(_folder, Guid.NewGuid().ToString("N") + ".pdf");
        File.WriteAllBytes(path, PdfReportWriter.Write(report));
        return path;
    }

    private static string Fold(string text) => string.Join(' ', text.Split((char[])[' ', '\n', '\r', '\t', '\f'], StringSplitOptions.RemoveEmptyEntries));

    [GeneratedRegex(@"\S…")]
    private static partial Regex CutWord();

    [GeneratedRegex(@"(?<![=·^] ?[\d.]*)\d\.\d{2,} nm\b")]
    private static partial Regex NmWithTwoOrMoreDecimals();
}
