using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class ChamberTests
{
    [Fact]
    public void Render_UnknownChamber_SaysSo()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Chamber>(p => p.Add(c => c.Name, "nowhere"));
        Assert.Contains("No chamber named nowhere", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Render_HotArsenicSource_ShowsReminderWithoutCloseButtonAndLogsIt()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Chamber>(p => p.Add(c => c.Name, InventedLabScenario.GrowingChamber));

        var reminder = page.Find("[data-rule=arsenic-source-hot]");
        Assert.Contains("as_cell_tc 342.0 °C above 150 °C", reminder.TextContent, StringComparison.Ordinal);
        Assert.Empty(reminder.QuerySelectorAll("button"));
        // The standing caution is printed once per page, by the layout's footer, not again beside each reminder list.
        Assert.DoesNotContain("never replace", page.Markup, StringComparison.Ordinal);
        var audit = await ctx.Data.GetAuditAsync(50, CancellationToken.None);
        Assert.Contains(audit, a => a.Action == "reminder shown" && a.User == "test-engineer" && a.Subject == "north-1 / arsenic-source-hot");
    }

    [Fact]
    public void Render_LiveData_ChartShipsAtMostMaxPoints()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Chamber>(p => p.Add(c => c.Name, InventedLabScenario.GrowingChamber));
        int points = int.Parse(page.Find("[data-testid=live-chart]").GetAttribute("data-points")!);
        Assert.InRange(points, 1000, 5000);
        Assert.Contains("WITHIN BAND", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_AlarmActive_DeviationBeyondAlarmBandSaysAlarm()
    {
        using var ctx = new DashboardTestContext();
        ctx.Data.AddSamples(InventedLabScenario.GrowingChamber, InventedLabScenario.TemperatureChannel, DashboardTestContext.Now, 625);
        var page = ctx.Render<Chamber>(p => p.Add(c => c.Name, InventedLabScenario.GrowingChamber));
        Assert.Contains("ALARM BAND", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_RolesWithoutChannel_ListedAsNotWatchedWithReason()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Chamber>(p => p.Add(c => c.Name, InventedLabScenario.GrowingChamber));

        var items = page.FindAll("[data-testid=not-watched-item]");
        Assert.Equal(["hydride-flowing", "bakeout-running", "electron-gun-on"], items.Select(i => i.GetAttribute("data-rule")));
        Assert.Contains("not watched on this chamber: no channel has the role HydrideFlow on this chamber", items[0].TextContent, StringComparison.Ordinal);
        // The mapped reminders are judged, not listed as unwatched.
        Assert.Empty(page.FindAll("[data-testid=not-watched-item][data-rule=arsenic-source-hot]"));
    }

    [Fact]
    public void Render_MappedChannelGoneStale_ReminderSaysNotWatched()
    {
        using var ctx = new DashboardTestContext();
        // The idle chamber's arsenic cell reading is 45 s old at seed time; 30 s later it is past the 60 s limit.
        ctx.Time.Advance(TimeSpan.FromSeconds(30));
        var page = ctx.Render<Chamber>(p => p.Add(c => c.Name, InventedLabScenario.IdleChamber));

        var arsenic = page.Find("[data-testid=not-watched-item][data-rule=arsenic-source-hot]");
        Assert.Contains("channel as_cell_tc (ArsenicSourceTemperature) last sampled 75 s ago (limit 60 s)", arsenic.TextContent, StringComparison.Ordinal);
    }
}
