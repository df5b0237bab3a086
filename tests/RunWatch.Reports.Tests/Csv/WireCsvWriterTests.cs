using System.Globalization;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Csv;
using RunWatch.Reports.Model;
using RunWatch.Reports.Tests.Support;
using Xunit;

namespace RunWatch.Reports.Tests.Csv;

public sealed class WireCsvWriterTests
{
    [Fact]
    public void Write_SampleReport_RoundTripsEveryWireExactly()
    {
        WaferReport report = SampleReport.Build();
        List<string[]> rows = CsvParser.Parse(WireCsvWriter.Write(report));

        Assert.Equal(WireCsvWriter.Columns, rows[0]);
        Assert.Equal(report.Wires.Count + 1, rows.Count);
        for (int i = 0; i < report.Wires.Count; i++)
        {
            WireRow w = report.Wires[i];
            string[] r = rows[i + 1];
            Assert.Equal(report.Identity.WaferId, r[0]);
            Assert.Equal(w.FieldName, r[1]);
            Assert.Equal(w.WireId, int.Parse(r[2], CultureInfo.InvariantCulture));
            Assert.Equal(w.XNm, double.Parse(r[3], CultureInfo.InvariantCulture));
            Assert.Equal(w.RadiusNm, double.Parse(r[5], CultureInfo.InvariantCulture));
            Assert.Equal(double.IsFinite(w.NormalisedArea) ? w.NormalisedArea.ToString("R", CultureInfo.InvariantCulture) : "", r[6]);
            Assert.Equal(w.Vertical, bool.Parse(r[8]));
        }
    }

    [Theory]
    [InlineData("plain", "plain")]
    [InlineData("with,comma", "with,comma")]
    [InlineData("with \"quotes\"", "with \"quotes\"")]
    [InlineData("two\r\nlines", "two\r\nlines")]
    [InlineData("=HYPERLINK(\"http://x\")", "'=HYPERLINK(\"http://x\")")]
    [InlineData("+1+2", "'+1+2")]
    [InlineData("-2+3", "'-2+3")]
    [InlineData("@SUM(A1)", "'@SUM(A1)")]
    [InlineData("\tTAB", "'\tTAB")]
    public void Write_OutsideText_IsQuotedAndFormulaGuarded(string fieldName, string expected)
    {
        // RFC 4180 quoting; formula guard per OWASP "CSV Injection" (COMMON PRACTICE).
        WaferReport report = SampleReport.Build(wiresPerField: 3);
        report = report with { Wires = [report.Wires[0] with { FieldName = fieldName }] };
        List<string[]> rows = CsvParser.Parse(WireCsvWriter.Write(report));
        Assert.Equal(2, rows.Count);
        Assert.Equal(expected, rows[1][1]);
        Assert.Equal(WireCsvWriter.Columns.Count, rows[1].Length);
    }

    [Fact]
    public void Write_NegativeCoordinate_IsNotPrefixed()
    {
        WaferReport report = SampleReport.Build(wiresPerField: 3);
        report = report with { Wires = [report.Wires[0] with { XNm = -12.5 }] };
        Assert.Equal("-12.5", CsvParser.Parse(WireCsvWriter.Write(report))[1][3]);
    }
}
