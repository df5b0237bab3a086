using Bunit;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

/// <summary>The wafer list: search, filters, sort, links to wafer, run and map, and the CSV link.</summary>
public sealed class WafersTests
{
    private static DashboardTestContext Context()
    {
        var ctx = new DashboardTestContext();
        (string Id, string Run, string Process, string? Verdict, double Mean, int Day)[] wafers =
            [("W-A1", "R-A", "nw-inv", "PASS", 30.2, 1), ("W-A2", "R-A", "nw-inv", "FAIL", 41.0, 1), ("W-B1", "R-B", "nw-thin", "WARN", 24.5, 2), ("W-C1", "", "nw-thin", null, double.NaN, 3)];
        foreach (var w in wafers)
        {
            ctx.Records.AddWafer(new InMemoryLabRecords.WaferEntry(w.Id, w.Run, w.Run.Length > 0 ? "north-1" : "", w.Process, DashboardTestContext.Now.AddDays(-10 + w.Day), w.Verdict, [],
                double.IsFinite(w.Mean) ? LabRecordsFactory.Digest(w.Mean, 0.1, 1e9, 0) : null, null));
        }
        return ctx;
    }

    [Fact]
    public void Render_NewestFirst_LinksToWaferRunAndMap()
    {
        using var ctx = Context();
        var page = ctx.Render<Wafers>();
        var rows = page.FindAll("[data-testid=wafer-row]");
        Assert.Equal(["W-C1", "W-B1"], rows.Take(2).Select(r => r.QuerySelector("a")!.TextContent));
        var b1 = rows[1];
        Assert.Equal(["wafers/W-B1", "runs/R-B", "wafers/W-B1/map"], b1.QuerySelectorAll("a").Select(a => a.GetAttribute("href")));
        Assert.Contains("not reported", rows[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("— nm", rows[0].TextContent, StringComparison.Ordinal);
        Assert.Equal("api/export/wafers.csv", page.Find("[data-testid=wafers-csv]").GetAttribute("href"));
    }

    [Fact]
    public void FilterByVerdictAndProcess_KeepsMatching()
    {
        using var ctx = Context();
        var page = ctx.Render<Wafers>();

        page.Find("[data-testid=wafer-process]").Change("nw-inv");
        Assert.Equal(2, page.FindAll("[data-testid=wafer-row]").Count);
        page.Find("[data-testid=wafer-verdict]").Change("FAIL");
        var row = Assert.Single(page.FindAll("[data-testid=wafer-row]"));
        Assert.Contains("W-A2", row.TextContent, StringComparison.Ordinal);
        Assert.Contains("1 of 4 wafers", page.Find("[data-testid=wafer-count]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void SearchAndSortByRadius_AscendingSmallestFirst()
    {
        using var ctx = Context();
        var page = ctx.Render<Wafers>();

        page.Find("[data-testid=sort-radius]").Click();
        // Ascending: the wafer without a radius first, then 24.5, 30.2, 41.0 nm.
        Assert.Equal(["W-C1", "W-B1", "W-A1", "W-A2"], page.FindAll("[data-testid=wafer-row]").Select(r => r.QuerySelector("a")!.TextContent));
        page.Find("[data-testid=wafer-search]").Input("R-A");
        Assert.Equal(2, page.FindAll("[data-testid=wafer-row]").Count);
    }

    [Fact]
    public void Render_NoWafers_SaysHowWafersAppear()
    {
        using var ctx = new DashboardTestContext();
        Assert.Contains("A wafer is known", ctx.Render<Wafers>().Find("[data-testid=no-wafers]").TextContent, StringComparison.Ordinal);
    }
}
