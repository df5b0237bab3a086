using Bunit;
using Microsoft.AspNetCore.Components;
using Microsoft.Extensions.DependencyInjection;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class RunsTests
{
    [Fact]
    public void Render_NoRuns_SaysHowRunsStart()
    {
        using var ctx = new DashboardTestContext(seed: false);
        Assert.Contains("run-start event", ctx.Render<Runs>().Find("[data-testid=no-runs]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Search_ByWafer_KeepsOnlyMatchingRun()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Runs>();
        Assert.Equal(3, page.FindAll("[data-testid=run-row]").Count);

        page.Find("[data-testid=run-search]").Input("W-2029");

        var row = Assert.Single(page.FindAll("[data-testid=run-row]"));
        Assert.Contains("R-2029", row.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Sort_BySetpointAscending_LowestFirst()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Runs>();
        page.FindAll("button.sort").Single(b => b.TextContent.StartsWith("Setpoint", StringComparison.Ordinal)).Click();
        Assert.Contains("R-2029", page.FindAll("[data-testid=run-row]")[0].TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_Verdicts_WordShapeAndLeffColumn()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Runs>();

        var row = page.FindAll("[data-testid=run-row]").Single(r => r.TextContent.Contains("R-2029", StringComparison.Ordinal));

        var verdict = row.QuerySelector("[data-testid=run-verdict] .state")!;
        Assert.Equal("normal", verdict.GetAttribute("data-state"));
        Assert.Contains("● PASS", verdict.TextContent, StringComparison.Ordinal);
        Assert.Equal("299.1 nm", row.QuerySelector("[data-testid=run-leff]")!.TextContent);
    }

    [Fact]
    public void Render_MeanRadius_MeanOverTheRunsReportedWafers()
    {
        using var ctx = new DashboardTestContext();
        ctx.Records.AddRun(new InMemoryLabRecords.RunEntry("R-2029", InventedLabScenario.IdleChamber, "nw-gaas-thin", DashboardTestContext.Now.AddDays(-1), 299.1, 589.7, 0));
        foreach (var (wafer, mean) in new[] { ("W-2029-A", 28.0), ("W-2029-B", 29.0) })
        {
            ctx.Records.AddWafer(new InMemoryLabRecords.WaferEntry(wafer, "R-2029", InventedLabScenario.IdleChamber, "nw-gaas-thin", DashboardTestContext.Now, "PASS", [],
                LabRecordsFactory.Digest(mean, 0.1, 1e9, 0), null));
        }
        var page = ctx.Render<Runs>();

        var row = page.FindAll("[data-testid=run-row]").Single(r => r.TextContent.Contains("R-2029", StringComparison.Ordinal));
        Assert.Equal("28.5 nm", row.QuerySelector("[data-testid=run-mean-radius]")!.TextContent);
        var other = page.FindAll("[data-testid=run-row]").First(r => !r.TextContent.Contains("R-2029", StringComparison.Ordinal));
        Assert.Equal("— nm", other.QuerySelector("[data-testid=run-mean-radius]")!.TextContent);
    }

    [Fact]
    public void CompareSelected_TwoTicked_OpensComparisonOfThoseRuns()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Runs>();
        var button = page.Find("[data-testid=compare-selected]");
        Assert.True(button.HasAttribute("disabled"));

        page.Find($"[data-testid=run-select][data-run={InventedLabScenario.EndedRun}]").Change(true);
        page.Find("[data-testid=run-select][data-run=R-2029]").Change(true);
        page.Find("[data-testid=compare-selected]").Click();

        var nav = ctx.Services.GetRequiredService<NavigationManager>();
        // Oldest first: R-2029 started a day before the ended run.
        Assert.EndsWith("compare?runs=" + Uri.EscapeDataString($"R-2029,{InventedLabScenario.EndedRun}"), nav.Uri, StringComparison.Ordinal);
    }
}
