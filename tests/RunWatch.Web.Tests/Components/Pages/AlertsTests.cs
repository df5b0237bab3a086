using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class AlertsTests
{
    [Fact]
    public void Render_NoAlerts_SaysNothingHere()
    {
        using var ctx = new DashboardTestContext(seed: false);
        Assert.NotNull(ctx.Render<Alerts>().Find("[data-testid=no-alerts]"));
    }

    [Fact]
    public async Task Acknowledge_Engineer_MovesAlertToAcknowledgedAndRecordsWho()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Alerts>();
        var row = page.Find($"[data-alert={InventedLabScenario.OpenAlert}]");
        Assert.Contains("ALARM · UNACKNOWLEDGED", row.TextContent, StringComparison.Ordinal);

        page.Find($"[data-alert={InventedLabScenario.OpenAlert}] [data-testid=comment]").Change("seen");
        page.Find($"[data-alert={InventedLabScenario.OpenAlert}] [data-testid=acknowledge]").Click();

        var alert = (await ctx.Data.GetAlertsAsync(CancellationToken.None)).Single(a => a.AlertId == InventedLabScenario.OpenAlert);
        Assert.Equal(AlertState.ActiveAcknowledged, alert.State);
        Assert.Equal("test-engineer", alert.AcknowledgedBy);
        Assert.Contains(await ctx.Data.GetAuditAsync(10, CancellationToken.None), a => a.Action == "alert acknowledged" && a.User == "test-engineer");
    }

    [Fact]
    public async Task Shelve_Engineer_ShelvesUntilChosenExpiry()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Alerts>();
        page.Find($"[data-alert={InventedLabScenario.OpenAlert}] [data-testid=comment]").Change("known sensor fault, ticket 12");
        page.Find($"[data-alert={InventedLabScenario.OpenAlert}] [data-testid=shelve-hours]").Change("4");
        page.Find($"[data-alert={InventedLabScenario.OpenAlert}] [data-testid=shelve]").Click();

        var alert = (await ctx.Data.GetAlertsAsync(CancellationToken.None)).Single(a => a.AlertId == InventedLabScenario.OpenAlert);
        Assert.Equal(AlertState.Shelved, alert.State);
        Assert.Equal(DashboardTestContext.Now.AddHours(4), alert.ShelvedUntil);

        ctx.Time.Advance(TimeSpan.FromHours(4.1));
        alert = (await ctx.Data.GetAlertsAsync(CancellationToken.None)).Single(a => a.AlertId == InventedLabScenario.OpenAlert);
        Assert.Equal(AlertState.ActiveUnacknowledged, alert.State);
    }

    [Fact]
    public async Task Acknowledge_Viewer_IsRefusedAndStateUnchanged()
    {
        using var ctx = new DashboardTestContext(role: "viewer");
        var page = ctx.Render<Alerts>();
        var button = page.Find($"[data-alert={InventedLabScenario.OpenAlert}] [data-testid=acknowledge]");
        Assert.True(button.HasAttribute("disabled"));
        Assert.Contains("viewer", page.Find("[data-testid=read-only]").TextContent, StringComparison.Ordinal);
        // The handler refuses too, should an event reach the circuit despite the disabled button.
        button.Click();

        Assert.Contains("Refused", page.Find("[data-testid=alert-message]").TextContent, StringComparison.Ordinal);
        var alert = (await ctx.Data.GetAlertsAsync(CancellationToken.None)).Single(a => a.AlertId == InventedLabScenario.OpenAlert);
        Assert.Equal(AlertState.ActiveUnacknowledged, alert.State);
    }

    [Fact]
    public void Render_Active_SeverityColumnAndSeparateChamberAndRunLinks()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Alerts>();

        var row = page.Find($"[data-alert={InventedLabScenario.OpenAlert}]");
        Assert.Equal("Alarm", row.GetAttribute("data-severity"));
        Assert.Contains("ALARM", row.QuerySelector("[data-testid=severity]")!.TextContent, StringComparison.Ordinal);
        Assert.Equal("chambers/" + InventedLabScenario.IdleChamber, row.QuerySelector("[data-testid=chamber-link]")!.GetAttribute("href"));
        Assert.StartsWith("runs/", row.QuerySelector("[data-testid=run-link]")!.GetAttribute("href"), StringComparison.Ordinal);
        // The shelve duration sits in one group with the Shelve button.
        Assert.NotNull(row.QuerySelector("[data-testid=shelve-group] [data-testid=shelve-hours]"));
        Assert.NotNull(row.QuerySelector("[data-testid=shelve-group] [data-testid=shelve]"));
    }

    [Fact]
    public void Render_SuppressedByDesign_OwnTabNotActiveNotHistoryNoActions()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<Alerts>();
        Assert.Empty(page.FindAll("[data-alert=A-0108]"));

        page.Find("[data-testid=tab-suppressed]").Click();
        var row = page.Find("[data-alert=A-0108]");
        string text = row.TextContent;
        bool hasButton = row.QuerySelector("button") is not null;
        page.Find("[data-testid=tab-history]").Click();

        Assert.Contains("SUPPRESSED BY DESIGN", text, StringComparison.Ordinal);
        Assert.False(hasButton);
        Assert.Empty(page.FindAll("[data-alert=A-0108]"));
        Assert.Contains("Suppressed by design (1)", page.Find("[data-testid=tab-suppressed]").TextContent, StringComparison.Ordinal);
    }
}
