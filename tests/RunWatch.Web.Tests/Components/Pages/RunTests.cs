using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class RunTests
{
    [Fact]
    public void Render_UnknownRun_SaysSo()
    {
        using var ctx = new DashboardTestContext();
        Assert.NotNull(ctx.Render<Run>(p => p.Add(r => r.RunId, "R-0000")).Find("[data-testid=no-run]"));
    }

    [Fact]
    public void Render_EndedRun_ShowsDiffusionLengthsWithConventionAndExcursion()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Run>(p => p.Add(r => r.RunId, InventedLabScenario.EndedRun));
        string thermal = page.Find("[data-testid=thermal]").TextContent;
        Assert.Contains("412.0 nm", thermal, StringComparison.Ordinal);
        Assert.Contains("418.6 nm", thermal, StringComparison.Ordinal);
        Assert.Contains("611.1 °C", thermal, StringComparison.Ordinal);
        Assert.Contains("c = 1", thermal, StringComparison.Ordinal);
        Assert.Contains("ALARM", page.Find("[data-testid=excursions]").TextContent, StringComparison.Ordinal);
        Assert.Contains("38.5 nm ± 6.2 nm", page.Find("[data-testid=prediction]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_LongRun_ChartIsDownsampledToMaxPoints()
    {
        using var ctx = new DashboardTestContext(seed: false);
        InventedLabScenario.Seed(ctx.Data, DashboardTestContext.Now, sampleRateHz: 10, endedRunHours: 2);
        var page = ctx.Render<Run>(p => p.Add(r => r.RunId, InventedLabScenario.EndedRun));
        var chart = page.Find("[data-testid=run-chart]");
        Assert.Equal("5000", chart.GetAttribute("data-points"));
        Assert.Equal("72001", chart.GetAttribute("data-source-points"));
    }
}
