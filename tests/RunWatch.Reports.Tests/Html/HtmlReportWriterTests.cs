using System.Xml;
using RunWatch.Reports.Html;
using RunWatch.Reports.Tests.Support;
using Xunit;

namespace RunWatch.Reports.Tests.Html;

public sealed class HtmlReportWriterTests
{
    private const string Malicious = "<script>alert(1)</script>";

    private static XmlDocument Parse(string html)
    {
        // System.Xml is the outside check of well-formedness: every tag closed and nested, entities defined.
        var settings = new XmlReaderSettings { DtdProcessing = DtdProcessing.Ignore, XmlResolver = null };
        using var reader = XmlReader.Create(new StringReader(html), settings);
        var doc = new XmlDocument { XmlResolver = null };
        doc.Load(reader);
        return doc;
    }

    [Fact]
    public void Write_SampleReport_IsWellFormedAndSelfContained()
    {
        string html = HtmlReportWriter.Write(SampleReport.Build());
        XmlDocument doc = Parse(html);

        Assert.Equal("html", doc.DocumentElement!.Name);
        // Self-contained: no external scripts, style sheets or images.
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("http://", html.Replace("http://www.w3.org/", "", StringComparison.Ordinal), StringComparison.Ordinal);
        Assert.DoesNotContain("https://", html, StringComparison.Ordinal);
        Assert.Equal(3, doc.GetElementsByTagName("img").Count);
        Assert.All(doc.GetElementsByTagName("img").Cast<XmlElement>(), img => Assert.StartsWith("data:image/png;base64,", img.GetAttribute("src"), StringComparison.Ordinal));
        Assert.Equal(4, doc.GetElementsByTagName("svg").Count);
        Assert.Contains("@media print", html, StringComparison.Ordinal);
        Assert.Contains("Verdicts support, never replace, an engineer&#39;s review", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_MaliciousWaferIdRecipeAndNote_AreEscapedEverywhere()
    {
        var report = SampleReport.Build(Malicious, note: "note " + Malicious + " & \"quoted\"");
        report = report with
        {
            Identity = report.Identity with { Recipe = "r" + Malicious, RunId = "\"><img src=x onerror=alert(2)>" },
            Fields = [report.Fields[0] with { FieldName = "f\" onload=\"alert(3)" }],
        };

        string html = HtmlReportWriter.Write(report);
        XmlDocument doc = Parse(html);

        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("onerror=alert", html.Replace("onerror=alert(2)&gt;", "", StringComparison.Ordinal), StringComparison.Ordinal);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", html, StringComparison.Ordinal);
        // The parsed text holds the original strings: escaped once, not twice.
        Assert.Contains(Malicious, doc.DocumentElement!.InnerText, StringComparison.Ordinal);
        Assert.Contains("\"><img src=x onerror=alert(2)>", doc.DocumentElement.InnerText, StringComparison.Ordinal);
        Assert.Equal(1, doc.GetElementsByTagName("img").Count);
        var img = (XmlElement)doc.GetElementsByTagName("img")[0]!;
        Assert.Equal("f\" onload=\"alert(3)", img.GetAttribute("alt"));
        Assert.False(img.HasAttribute("onload"));
    }

    [Fact]
    public void Write_VerdictAndReasons_AppearInTheVerdictSection()
    {
        var report = SampleReport.Build();
        XmlDocument doc = Parse(HtmlReportWriter.Write(report));
        XmlElement section = doc.GetElementsByTagName("section").Cast<XmlElement>().First();
        Assert.Contains("verdict", section.GetAttribute("class"), StringComparison.Ordinal);
        Assert.Contains("Verdict: " + HtmlReportWriter.VerdictWord(report.Verdict.Outcome), section.InnerText, StringComparison.Ordinal);
        foreach (var reason in report.Verdict.Reasons)
        {
            Assert.Contains(reason.Reason, section.InnerText, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Write_ThumbnailThatIsNotPng_IsLeftOutWithNote()
    {
        var report = SampleReport.Build();
        report = report with { Fields = [report.Fields[0] with { Png = new byte[] { 1, 2, 3, 4, 5, 6, 7, 8, 9 } }] };
        string html = HtmlReportWriter.Write(report);
        Assert.Equal(0, Parse(html).GetElementsByTagName("img").Count);
        Assert.Contains("not a PNG image", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_ManyWires_LimitsTableAndPointsToCsv()
    {
        var report = SampleReport.Build(wiresPerField: 100);
        XmlDocument doc = Parse(HtmlReportWriter.Write(report));
        XmlElement wires = doc.GetElementsByTagName("section").Cast<XmlElement>().Single(s => s.GetAttribute("class") == "wires");
        Assert.Equal(HtmlReportWriter.MaxWireRows, wires.GetElementsByTagName("tbody")[0]!.ChildNodes.OfType<XmlElement>().Count());
        Assert.Contains("CSV file holds every wire", wires.InnerText, StringComparison.Ordinal);
    }
}
