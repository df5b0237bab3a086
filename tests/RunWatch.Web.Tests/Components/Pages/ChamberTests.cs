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
        Assert.Contains("never replace, the hardware interlocks", page.Markup, StringComparison.Ordinal);
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
}
