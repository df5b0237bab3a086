using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class SettingsTests
{
    [Fact]
    public void Render_Viewer_SpecsReadOnlyAndSecretsHidden()
    {
        using var ctx = new DashboardTestContext(role: "viewer");
        var page = ctx.Render<Settings>();
        Assert.All(page.FindAll("[data-testid=specs] input"), i => Assert.True(i.HasAttribute("disabled")));
        Assert.Contains("RunWatch:Dashboard:MaxChartPoints", page.Find("[data-testid=config]").TextContent, StringComparison.Ordinal);
        Assert.DoesNotContain("PasswordHash", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public async Task SaveSpec_Admin_WritesAuditEntryWithName()
    {
        using var ctx = new DashboardTestContext(role: "admin");
        var page = ctx.Render<Settings>();
        var inputs = page.FindAll("[data-testid=specs] tr")[1].QuerySelectorAll("input");
        page.FindAll("[data-testid=specs] tr")[1].QuerySelectorAll("input")[1].Change("44");
        page.FindAll("[data-testid=specs] tr")[1].QuerySelector("button")!.Click();

        Assert.Equal(4, inputs.Length); // fail window and warn window
        var spec = (await ctx.Data.GetSpecsAsync(CancellationToken.None)).Single(s => s.Name == "mean radius");
        Assert.Equal(44, spec.Max);
        Assert.Contains(await ctx.Data.GetAuditAsync(10, CancellationToken.None), a => a.Action == "spec edited" && a.User == "test-admin");
    }

    [Fact]
    public async Task SaveBinding_Admin_ChamberNowWatchesRoleAndAuditNamesAdmin()
    {
        using var ctx = new DashboardTestContext(role: "admin");
        var page = ctx.Render<Settings>();
        var row = page.Find("[data-testid=binding-row][data-chamber=north-1][data-role=Bakeout]");
        Assert.Contains("NOT WATCHED", row.TextContent, StringComparison.Ordinal);

        row.QuerySelector("select")!.Change("ln2_fill");
        page.Find("[data-testid=binding-row][data-chamber=north-1][data-role=Bakeout] button").Click();

        Assert.Contains("saved by test-admin", page.Find("[data-testid=settings-message]").TextContent, StringComparison.Ordinal);
        Assert.Contains("ln2_fill", page.Find("[data-testid=binding-row][data-chamber=north-1][data-role=Bakeout]").TextContent, StringComparison.Ordinal);
        var audit = await ctx.Data.GetAuditAsync(10, CancellationToken.None);
        Assert.Contains(audit, a => a.Action == "reminder binding edited" && a.User == "test-admin" && a.Detail == "Bakeout: no channel → ln2_fill");
    }

    [Fact]
    public async Task SaveBinding_Engineer_RefusedAndNothingChanged()
    {
        using var ctx = new DashboardTestContext(role: "engineer");
        var page = ctx.Render<Settings>();

        page.Find("[data-testid=binding-row][data-chamber=north-1][data-role=Bakeout] button").Click();

        Assert.Equal("Refused: choosing reminder channels needs the admin role.", page.Find("[data-testid=settings-message]").TextContent);
        Assert.DoesNotContain(await ctx.Data.GetAuditAsync(10, CancellationToken.None), a => a.Action.StartsWith("reminder binding", StringComparison.Ordinal));
    }

    [Fact]
    public async Task AuditLog_ReminderShowingsHiddenUntilAsked()
    {
        using var ctx = new DashboardTestContext(role: "admin");
        await ctx.Data.RecordAuditAsync(new RunWatch.Web.Data.AuditEntry(DashboardTestContext.Now, "someone", "reminder shown", "north-1 / x", "r"), CancellationToken.None);
        await ctx.Data.RecordAuditAsync(new RunWatch.Web.Data.AuditEntry(DashboardTestContext.Now, "someone", "alert acknowledged", "alert 1", "ok"), CancellationToken.None);
        var page = ctx.Render<Settings>();

        string hidden = page.Find("[data-testid=audit]").TextContent;
        page.Find("[data-testid=audit-show-reminders]").Change(true);
        string shown = page.Find("[data-testid=audit]").TextContent;

        Assert.DoesNotContain("reminder shown", hidden, StringComparison.Ordinal);
        Assert.Contains("alert acknowledged", hidden, StringComparison.Ordinal);
        Assert.Contains("reminder shown", shown, StringComparison.Ordinal);
    }
}
