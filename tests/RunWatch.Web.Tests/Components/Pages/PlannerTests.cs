using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class PlannerTests
{
    [Fact]
    public void Render_DefaultInputs_ShowsDiffusionLengthAndRadiusWithUnits()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Planner>();
        string result = page.Find("[data-testid=plan-result]").TextContent;
        Assert.Matches(@"\d+\.\d nm", result);
        Assert.Contains("°C", result, StringComparison.Ordinal);
    }

    [Fact]
    public void Predict_HotterGrowth_LongerDiffusionLength()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Planner>();
        double cool = FirstNm(page.Find("[data-testid=plan-result]").TextContent);
        page.Find("[data-testid=plan-temperature]").Change("640");
        page.Find("[data-testid=plan-run]").Click();
        double hot = FirstNm(page.Find("[data-testid=plan-result]").TextContent);
        Assert.True(hot > cool, $"L_eff at 640 °C ({hot} nm) should exceed L_eff at 610 °C ({cool} nm)");
    }

    private static double FirstNm(string text) =>
        double.Parse(System.Text.RegularExpressions.Regex.Match(text, @"([\d.]+) nm").Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);
}
