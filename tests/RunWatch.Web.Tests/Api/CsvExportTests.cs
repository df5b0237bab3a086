using System.Globalization;
using Microsoft.VisualBasic.FileIO;
using RunWatch.Web.Api;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Api;

public sealed class CsvExportTests
{
    /// <summary>Parsed back with the framework's own RFC 4180 reader (Microsoft.VisualBasic TextFieldParser), not CsvHelper.</summary>
    private static List<string[]> Parse(string csv)
    {
        using var parser = new TextFieldParser(new StringReader(csv)) { TextFieldType = FieldType.Delimited, HasFieldsEnclosedInQuotes = true };
        parser.SetDelimiters(",");
        var rows = new List<string[]>();
        while (!parser.EndOfData)
        {
            rows.Add(parser.ReadFields()!);
        }
        return rows;
    }

    [Fact]
    public async Task Runs_InventedLab_OneRowPerRunWithLeffAndVerdict()
    {
        using var ctx = new DashboardTestContext();
        var runs = await ctx.Data.GetRunsAsync(CancellationToken.None);

        var rows = Parse(CsvExport.Runs(runs));

        Assert.Equal(runs.Count + 1, rows.Count);
        Assert.Equal("l_eff_nm", rows[0][7]);
        var r2029 = rows.Single(r => r[0] == "R-2029");
        Assert.Equal(299.1, double.Parse(r2029[7], CultureInfo.InvariantCulture));
        Assert.Equal("pass", r2029[8]);
    }

    [Fact]
    public void Alerts_CommaQuoteAndFormulaText_QuotedAndEscaped()
    {
        var alert = new AlertView("7", "north-1", null, "peak 612 °C, \"sharp\"", AlertSeverity.Alarm, AlertState.Suppressed,
            DashboardTestContext.Now, null, null, "=HYPERLINK(\"x\")", null, null);

        var rows = Parse(CsvExport.Alerts([alert]));

        Assert.Equal("peak 612 °C, \"sharp\"", rows[1][6]);
        Assert.Equal("yes", rows[1][3]);
        Assert.Equal("2026-03-04T10:00:00.000Z", rows[1][7]);
        // A cell starting with '=' must not reach a spreadsheet as a formula.
        Assert.False(rows[1][10].StartsWith('='));
        Assert.Contains("HYPERLINK", rows[1][10], StringComparison.Ordinal);
    }

    [Fact]
    public void Wafers_Rows_ReadBackWithFormulaEscaped()
    {
        WaferListRow[] wafers =
        [
            new("W-1", "R-1", "north-1", "nw-inv", "PASS", DashboardTestContext.Now, 30.25, 3),
            new("=cmd|' /C calc'!A0", "", "", "nw, thin", null, DashboardTestContext.Now.AddDays(-1), double.NaN, 0),
        ];

        var rows = Parse(CsvExport.Wafers(wafers));

        Assert.Equal(["wafer", "run", "chamber", "process", "verdict", "date_utc", "mean_radius_nm", "fields"], rows[0]);
        Assert.Equal(["W-1", "R-1", "north-1", "nw-inv", "PASS", "2026-03-04T10:00:00.000Z", "30.25", "3"], rows[1]);
        Assert.Equal("nw, thin", rows[2][3]);
        Assert.Equal("", rows[2][6]);
        Assert.False(rows[2][0].StartsWith('='));
        Assert.Contains("calc", rows[2][0], StringComparison.Ordinal);
    }
}
