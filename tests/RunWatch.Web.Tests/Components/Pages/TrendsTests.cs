using Bunit;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

/// <summary>Trend control charts: limits from the accepted baseline only, the Western Electric rules named, points linking to runs.</summary>
public sealed class TrendsTests
{
    /// <summary>Eight accepted runs alternating 30 and 31 nm, then a run at 40 nm; λ_eff alternates 300 and 310 nm.</summary>
    private static void Seed(InMemoryLabRecords records, int runs = 9)
    {
        for (int i = 0; i < runs; i++)
        {
            string run = $"R-T{i + 1:00}";
            double mean = i == 8 ? 40 : 30 + (i % 2);
            records.AddRun(new InMemoryLabRecords.RunEntry(run, "north-1", "nw-inv", DashboardTestContext.Now.AddDays(i - 10), 300 + (10 * (i % 2)), 610, 0));
            records.AddWafer(new InMemoryLabRecords.WaferEntry($"W-T{i + 1:00}", run, "north-1", "nw-inv", DashboardTestContext.Now.AddDays(i - 10),
                i == 8 ? "WARN" : "PASS", [], LabRecordsFactory.Digest(mean, 0.1, 1e9, 0.2), null));
        }
    }

    [Fact]
    public void Render_OutlierAfterBaseline_LimitsFromBaselineAndRule1Named()
    {
        using var ctx = new DashboardTestContext();
        Seed(ctx.Records);
        var page = ctx.Render<Trends>();

        // Baseline 30, 31, … (8 runs): centre 30.5; moving ranges all 1 → σ̂ = 1 / 1.1284 = 0.886; UCL = 30.5 + 3 · 0.886 = 33.16 (DERIVED).
        string limits = page.Find("[data-testid=limits-radius]").TextContent;
        Assert.Contains("Baseline 8 run(s)", limits, StringComparison.Ordinal);
        Assert.Contains("CL 30.5", limits, StringComparison.Ordinal);
        Assert.Contains("UCL 33.2", limits, StringComparison.Ordinal);
        var chart = page.Find("[data-testid=trend-radius]");
        var flagged = chart.QuerySelectorAll("[data-testid=trend-point][data-flagged=yes]");
        var point = Assert.Single(flagged);
        Assert.Equal("runs/R-T09", point.GetAttribute("href"));
        Assert.Contains("WE rule 1: one point beyond 3σ", page.Find("[data-testid=flags-radius]").TextContent, StringComparison.Ordinal);
        Assert.Equal(9, chart.QuerySelectorAll("[data-testid=trend-point]").Length);
        Assert.Contains("first 8 runs of nw-inv on north-1 whose verdict is PASS", page.Find("[data-testid=baseline-note]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_ConstantFigure_NoSpreadNoLimits()
    {
        using var ctx = new DashboardTestContext();
        Seed(ctx.Records);
        var page = ctx.Render<Trends>();

        // CV is 10 % on every run: no spread in the baseline, so no limits and no rules.
        Assert.Contains("no spread", page.Find("[data-testid=limits-cv]").TextContent, StringComparison.Ordinal);
        Assert.Empty(page.Find("[data-testid=trend-cv]").QuerySelectorAll("[data-flagged=yes]"));
    }

    [Fact]
    public void ChangeBaseline_ToFour_LimitsFromFourRuns()
    {
        using var ctx = new DashboardTestContext();
        Seed(ctx.Records);
        var page = ctx.Render<Trends>();

        page.Find("[data-testid=trend-baseline]").Change("4");

        Assert.Contains("Baseline 4 run(s): R-T01, R-T02, R-T03, R-T04", page.Find("[data-testid=limits-leff]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_OneAcceptedRun_SaysNoLimitsYet()
    {
        using var ctx = new DashboardTestContext();
        Seed(ctx.Records, runs: 1);
        var page = ctx.Render<Trends>();
        Assert.Contains("No control limits yet: the baseline has 1 of 8", page.Find("[data-testid=limits-radius]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_NoRuns_SaysWhenRunsAppear()
    {
        using var ctx = new DashboardTestContext();
        Assert.Contains("once it has ended", ctx.Render<Trends>().Find("[data-testid=no-trends]").TextContent, StringComparison.Ordinal);
    }
}
