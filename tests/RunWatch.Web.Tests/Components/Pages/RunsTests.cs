using Bunit;
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
}
