using RunWatch.Reports.Tests.Support;
using RunWatch.Testing.Documents;
using RunWatch.Core.Qc;
using RunWatch.Reports.Html;
using Xunit;

namespace RunWatch.Reports.Tests;

public sealed class WaferReportWriterTests
{
    [Fact]
    public void WriteAll_SampleReport_WritesFourFilesThatPopplerReads()
    {
        using var folder = new TempFolder();
        var report = SampleReport.Build();

        ReportFiles files = WaferReportWriter.WriteAll(report, folder.Path);

        Assert.All([files.HtmlPath, files.PdfPath, files.CsvPath, files.JsonPath], p => Assert.True(new FileInfo(p).Length > 100, p));
        Assert.Equal(4, Directory.GetFiles(folder.Path).Length);
        // Real PDF reader: poppler's pdfinfo (Debian poppler-utils) parses the file and counts its pages.
        string info = PopplerText.Run("pdfinfo", files.PdfPath);
        Assert.Contains("Wafer report W-DEMO-0412-A", info, StringComparison.Ordinal);
        int pages = int.Parse(info.Split('\n').Single(l => l.StartsWith("Pages:", StringComparison.Ordinal))[6..].Trim(), System.Globalization.CultureInfo.InvariantCulture);
        Assert.InRange(pages, 3, 12);
    }

    [Fact]
    public void WriteAll_PdfText_ContainsWaferIdVerdictAndEveryReason()
    {
        using var folder = new TempFolder();
        var report = SampleReport.Build();
        Assert.NotEqual(QcOutcome.Pass, report.Verdict.Outcome);
        Assert.NotEmpty(report.Verdict.Reasons);

        ReportFiles files = WaferReportWriter.WriteAll(report, folder.Path);
        string text = PopplerText.Text(files.PdfPath);

        Assert.Contains("W-DEMO-0412-A", text, StringComparison.Ordinal);
        Assert.Contains("Verdict: " + HtmlReportWriter.VerdictWord(report.Verdict.Outcome), text, StringComparison.Ordinal);
        foreach (QcRuleResult reason in report.Verdict.Reasons)
        {
            Assert.Contains(reason.Reason, text, StringComparison.Ordinal);
        }
        Assert.Contains("Verdicts support, never replace, an engineer's review", text, StringComparison.Ordinal);
        Assert.Contains("hardware interlocks", text, StringComparison.Ordinal);
        Assert.Contains(SampleReport.DataLabel, text, StringComparison.Ordinal);
        Assert.Contains("L_eff", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("../../etc/passwd", "etc_passwd")]
    [InlineData("<script>alert(1)</script>", "script_alert_1___script")]
    [InlineData("W-0412-A", "W-0412-A")]
    [InlineData("...", "wafer")]
    [InlineData("", "wafer")]
    public void SafeFileName_HostileOrOddIds_StayInsideTheFolder(string waferId, string expected)
    {
        // COMMON PRACTICE: a file name built from outside input keeps only a safe character set.
        string name = WaferReportWriter.SafeFileName(waferId);
        Assert.Equal(expected, name);
        Assert.DoesNotContain('/', name);
        Assert.False(name.StartsWith('.'));
    }

    [Fact]
    public void WriteAll_MaliciousWaferId_WritesOnlyInsideFolderAndLeavesNoTemporaryFiles()
    {
        using var folder = new TempFolder();
        var report = SampleReport.Build("../<script>alert(1)</script>");
        ReportFiles files = WaferReportWriter.WriteAll(report, folder.Path);
        Assert.All([files.HtmlPath, files.PdfPath, files.CsvPath, files.JsonPath], p => Assert.Equal(folder.Path, Path.GetDirectoryName(p)));
        Assert.DoesNotContain(Directory.GetFiles(folder.Path), p => p.Contains(".tmp-", StringComparison.Ordinal));
    }

    [Fact]
    public void WriteAll_EmptyReport_StillWritesEveryFileWithTheFailVerdict()
    {
        // Bad or missing input must not lose the report: an analysis that found nothing still gets its verdict on paper.
        using var folder = new TempFolder();
        var report = SampleReport.Empty();
        Assert.Equal(QcOutcome.Fail, report.Verdict.Outcome);

        ReportFiles files = WaferReportWriter.WriteAll(report, folder.Path);

        string text = PopplerText.Text(files.PdfPath);
        Assert.Contains("W-DEMO-EMPTY", text, StringComparison.Ordinal);
        Assert.Contains("Verdict: FAIL", text, StringComparison.Ordinal);
        Assert.Contains("No accepted radius model", text, StringComparison.Ordinal);
        Assert.Single(Support.CsvParser.Parse(File.ReadAllText(files.CsvPath)));
        Assert.Equal(QcOutcome.Fail, RunWatch.Reports.Json.JsonSummaryWriter.Read(File.ReadAllText(files.JsonPath)).Verdict.Outcome);
    }
}
