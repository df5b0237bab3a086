using Bunit;
using RunWatch.Storage;
using RunWatch.Web.Data;
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
        // Reading, setpoint and the two band-edge lines share the cap of 5000 points.
        Assert.InRange(int.Parse(chart.GetAttribute("data-points")!, System.Globalization.CultureInfo.InvariantCulture), 4900, 5000);
        Assert.Equal("144002", chart.GetAttribute("data-source-points")); // 72001 readings and 72001 setpoint samples
    }

    [Fact]
    public void Render_RunWithoutAcceptedDiffusionModel_SaysSoAndLabelsTheRegression()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Run>(p => p.Add(r => r.RunId, InventedLabScenario.EndedRun));
        Assert.NotNull(page.Find("[data-testid=diffusion-none]"));
        Assert.Contains("Â regression", page.Find("[data-testid=prediction-model]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Render_RunWithDiffusionFigures_ShowsLambdasRadiusAndExcursionEffectInNm()
    {
        using var ctx = new DashboardTestContext();
        RunDetail ended = (await ctx.Data.GetRunAsync(InventedLabScenario.EndedRun, CancellationToken.None))!;
        ctx.Data.AddRun(ended with
        {
            Summary = ended.Summary with { RunId = "R-DIFF-VIEW" },
            Diffusion = new RunDiffusionFigures(7, 812.34, 845.66, 41.26, 3.04, true, [new RunExcursionRadiusChange(600, 780, 1.84, 22.5)], null),
        });
        var page = ctx.Render<Run>(p => p.Add(r => r.RunId, "R-DIFF-VIEW"));
        string text = page.Find("[data-testid=diffusion]").TextContent;
        Assert.Contains("812.3 nm", text, StringComparison.Ordinal);
        Assert.Contains("845.7 nm", text, StringComparison.Ordinal);
        Assert.Contains("41.3 nm ± 3.0 nm", text, StringComparison.Ordinal);
        Assert.Contains("+1.8 nm", text, StringComparison.Ordinal);
        Assert.NotNull(page.Find("[data-testid=diffusion-extrapolated]"));
    }
}
