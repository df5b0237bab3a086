using System.Text.RegularExpressions;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using RunWatch.Reports.Tests.Support;
using RunWatch.Testing.Documents;
using Xunit;

namespace RunWatch.Reports.Tests;

/// <summary>Wire and droplet radius in the report (invented figures), read back from the PDF by poppler's pdftotext and from the HTML.</summary>
public sealed class DropletReportTests
{
    [Fact]
    public void WriteAll_WithDroplets_PdfAndHtmlShowWireAndDropletRadiusAndCount()
    {
        using var folder = new TempFolder();
        var wafer = new DropletFigures(WithDroplet: 14, WithBoth: 11, MeanWireRadiusNm: 31.24, MeanDropletRadiusNm: 40.06, MeanDropletOnlyRadiusNm: 44.5);
        WaferReport sample = SampleReport.Build();
        var fields = sample.Fields.Select((f, i) => i == 0 ? f with { Droplets = new DropletFigures(6, 6, 30.5, 39.1, double.NaN) } : f).ToList();
        WaferReport report = sample with { Fields = fields, Droplets = wafer };

        ReportFiles files = WaferReportWriter.WriteAll(report, folder.Path);
        // Line breaks of the PDF's wrapped paragraphs read as spaces.
        string pdf = Regex.Replace(PopplerText.Text(files.PdfPath), @"\s+", " ");
        string html = File.ReadAllText(files.HtmlPath);

        foreach (string text in new[] { pdf, html })
        {
            Assert.Contains("Wires with a droplet: 14", text, StringComparison.Ordinal);
            Assert.Contains("mean wire radius 31.2 nm, mean droplet radius 40.1 nm (same 11 wires)", text, StringComparison.Ordinal);
            Assert.Contains("3 show only their droplet (mean 44.5 nm)", text, StringComparison.Ordinal);
        }
        Assert.Contains("6 with droplet", pdf, StringComparison.Ordinal);
        Assert.Contains("with droplet: 6; mean wire radius 30.5 nm, mean droplet radius 39.1 nm", html, StringComparison.Ordinal);
    }

    [Fact]
    public void WriteAll_NoDroplets_SaysNothingAboutDroplets()
    {
        using var folder = new TempFolder();

        ReportFiles files = WaferReportWriter.WriteAll(SampleReport.Build() with { Droplets = DropletFigures.None }, folder.Path);

        Assert.DoesNotContain("droplet", PopplerText.Text(files.PdfPath), StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("droplet", File.ReadAllText(files.HtmlPath), StringComparison.OrdinalIgnoreCase);
    }
}
