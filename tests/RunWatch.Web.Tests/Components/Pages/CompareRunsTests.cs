using Bunit;
using Microsoft.AspNetCore.Components;
using Microsoft.Extensions.DependencyInjection;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

/// <summary>Run comparison over the invented lab: figures side by side, the overlay chart, and what it says with fewer than two runs.</summary>
public sealed class CompareRunsTests
{
    private static IRenderedComponent<CompareRuns> Open(DashboardTestContext ctx, string runs)
    {
        var nav = ctx.Services.GetRequiredService<NavigationManager>();
        nav.NavigateTo(nav.GetUriWithQueryParameter("runs", runs));
        return ctx.Render<CompareRuns>();
    }

    [Fact]
    public void Render_TwoRuns_FiguresSideBySide()
    {
        using var ctx = new DashboardTestContext();
        ctx.Records.AddRun(new InMemoryLabRecords.RunEntry("R-2029", InventedLabScenario.IdleChamber, "nw-gaas-thin", DashboardTestContext.Now.AddDays(-1), 299.1, 589.7, 0));
        ctx.Records.AddWafer(new InMemoryLabRecords.WaferEntry("W-2029-A", "R-2029", InventedLabScenario.IdleChamber, "nw-gaas-thin", DashboardTestContext.Now, "PASS", [],
            LabRecordsFactory.Digest(28.4, 0.12, 1e9, 0.3), null));
        var page = Open(ctx, $"{InventedLabScenario.EndedRun},R-2029");

        Assert.Equal([InventedLabScenario.EndedRun, "R-2029"], page.FindAll("[data-testid=compare-run]").Select(a => a.TextContent));
        Assert.Equal(["611.1 °C", "589.7 °C"], page.FindAll("[data-testid=compare-teff]").Select(c => c.TextContent));
        Assert.Equal(["418.6 nm", "299.1 nm"], page.FindAll("[data-testid=compare-leff]").Select(c => c.TextContent));
        Assert.Equal(["— nm", "28.4 nm"], page.FindAll("[data-testid=compare-radius]").Select(c => c.TextContent));
        Assert.Single(page.FindAll("[data-testid=compare-thermal]"));
        Assert.DoesNotContain("NaN", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_OneRunOrUnknown_AsksForTwo()
    {
        using var ctx = new DashboardTestContext();
        var page = Open(ctx, InventedLabScenario.EndedRun + ",R-NONE");
        string text = page.Find("[data-testid=compare-empty]").TextContent;
        Assert.Contains("two or more runs", text, StringComparison.Ordinal);
        Assert.Contains("Not found: R-NONE", text, StringComparison.Ordinal);
    }
}
