using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class WaferTests
{
    [Fact]
    public void Render_UnknownWafer_SaysSo()
    {
        using var ctx = new DashboardTestContext();
        Assert.NotNull(ctx.Render<Wafer>(p => p.Add(w => w.WaferId, "W-0")).Find("[data-testid=no-wafer]"));
    }

    [Fact]
    public void Render_Wafer_ShowsVerdictReasonsStatisticsAndReportLinks()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Wafer>(p => p.Add(w => w.WaferId, InventedLabScenario.Wafer));
        Assert.Contains("WARN", page.Find("[data-testid=verdict]").TextContent, StringComparison.Ordinal);
        Assert.Contains("an alarm excursion of 9.0 K", page.Markup, StringComparison.Ordinal);
        Assert.Contains("1.42 µm⁻²", page.Find("[data-testid=wafer-stats]").TextContent, StringComparison.Ordinal);
        Assert.Equal("api/wafers/W-2030-A/reports/csv", page.Find("[data-testid=report-csv]").GetAttribute("href"));
    }

    [Fact]
    public void Overlay_TurnedOff_ImagesRequestPlainFields()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Wafer>(p => p.Add(w => w.WaferId, InventedLabScenario.Wafer));
        Assert.All(page.FindAll(".field img"), img => Assert.EndsWith("overlay=true", img.GetAttribute("src"), StringComparison.Ordinal));
        page.Find("[data-testid=overlay]").Change(false);
        Assert.All(page.FindAll(".field img"), img => Assert.EndsWith("overlay=false", img.GetAttribute("src"), StringComparison.Ordinal));
    }

    [Fact]
    public async Task Assign_Engineer_MovesFieldToWafer_ViewerRefused()
    {
        using (var viewer = new DashboardTestContext(role: "viewer"))
        {
            var page = viewer.Render<Wafer>(p => p.Add(w => w.WaferId, InventedLabScenario.Wafer));
            page.Find("[data-testid=assign]").Click();
            Assert.Contains("Refused", page.Find("[data-testid=assign-message]").TextContent, StringComparison.Ordinal);
            Assert.Single(await viewer.Data.GetUnmatchedFieldsAsync(CancellationToken.None));
        }
        using var ctx = new DashboardTestContext();
        var engineerPage = ctx.Render<Wafer>(p => p.Add(w => w.WaferId, InventedLabScenario.Wafer));
        engineerPage.Find("[data-testid=assign]").Click();
        Assert.Empty(await ctx.Data.GetUnmatchedFieldsAsync(CancellationToken.None));
        Assert.Equal(3, (await ctx.Data.GetWaferAsync(InventedLabScenario.Wafer, CancellationToken.None))!.Fields.Count);
    }

    [Fact]
    public void Render_Verdict_EveryRuleWithMeasuredLimitAndReason_PredictionSummaryBesideChart()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Wafer>(p => p.Add(w => w.WaferId, InventedLabScenario.Wafer));

        var rules = page.FindAll("[data-testid=verdict-rule]");
        Assert.Equal(4, rules.Count);
        // Passed rules are listed too, with the measured value and the limit.
        Assert.Contains("38.9", rules[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("30–45", rules[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("PASS", rules[0].TextContent, StringComparison.Ordinal);
        // A rule that could not be measured says so and why.
        Assert.Contains("not measured", rules[3].TextContent, StringComparison.Ordinal);
        Assert.Contains("no accepted radius model", rules[3].TextContent, StringComparison.Ordinal);
        string summary = page.Find("[data-testid=prediction-summary]").TextContent;
        Assert.Contains("+0.8 nm", summary, StringComparison.Ordinal);
        Assert.Contains("3.1 nm", summary, StringComparison.Ordinal);
        Assert.Contains("0.710", summary, StringComparison.Ordinal);
    }
}
