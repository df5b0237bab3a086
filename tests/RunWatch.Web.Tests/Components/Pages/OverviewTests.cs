using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class OverviewTests
{
    [Fact]
    public void Render_NoChambers_SaysHowToAddThem()
    {
        using var ctx = new DashboardTestContext(seed: false);
        var page = ctx.Render<Overview>();
        Assert.Contains("No chambers are configured", page.Find("[data-testid=no-chambers]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_LiveData_ShowsTemperatureWithUnitRunAndGrowthWindow()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Overview>();
        var card = page.Find("[data-chamber=north-1]");
        Assert.EndsWith(" °C", card.QuerySelector("[data-testid=temperature]")!.TextContent, StringComparison.Ordinal);
        Assert.Contains("RUN R-2031 IN PROGRESS", card.TextContent, StringComparison.Ordinal);
        Assert.Contains("Growth window 09:40:00 UTC+00:00 – 10:10:00 UTC+00:00", card.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Notifier_SampleCommitted_CardShowsNewValueWithoutReload()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Overview>();
        var at = DashboardTestContext.Now;
        ctx.Data.AddSamples(InventedLabScenario.GrowingChamber, InventedLabScenario.TemperatureChannel, at, 612.3);

        ctx.Hub.SamplesCommitted([new LiveSample(InventedLabScenario.GrowingChamber, InventedLabScenario.TemperatureChannel, at, 612.3)]);

        page.WaitForAssertion(() => Assert.Equal("612.3 °C", page.Find("[data-chamber=north-1] [data-testid=temperature]").TextContent),
            TimeSpan.FromSeconds(5));
    }

    [Fact]
    public void Render_AlarmActive_ShowsOpenAlertAsWordsNotOnlyColour()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Overview>();
        var south = page.Find("[data-chamber=south-2] [data-testid=open-alerts]");
        Assert.Contains("1 OPEN ALERT", south.TextContent, StringComparison.Ordinal);
        Assert.Contains("■", south.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_OpenAlertBadge_TakesHighestOpenSeverity()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Overview>();

        // south-2 has an unacknowledged alarm; north-1 only an acknowledged warning (its suppressed ramp record is not open).
        var south = page.Find("[data-chamber=south-2] [data-testid=open-alerts]");
        var north = page.Find("[data-chamber=north-1] [data-testid=open-alerts]");

        Assert.Equal("Alarm", south.GetAttribute("data-severity"));
        Assert.Contains("■", south.TextContent, StringComparison.Ordinal);
        Assert.Equal("Warning", north.GetAttribute("data-severity"));
        Assert.Contains("▲", north.TextContent, StringComparison.Ordinal);
        Assert.Contains("1 OPEN ALERT · WARNING", north.TextContent, StringComparison.Ordinal);
    }
}
