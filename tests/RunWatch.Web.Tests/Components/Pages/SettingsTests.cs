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
}
