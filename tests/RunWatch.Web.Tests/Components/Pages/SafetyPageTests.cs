using Bunit;
using RunWatch.Core.Safety;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

public sealed class SafetyPageTests
{
    [Fact]
    public void Render_EveryLimitRow_ShowsValueUnitAveragingSourceAndEdition()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<SafetyPage>();
        Assert.Contains("hardware interlocks", page.Find("[data-testid=disclaimer]").TextContent, StringComparison.Ordinal);
        var rows = page.FindAll("[data-testid=limits] tr").Skip(1).ToList();
        Assert.Equal(ExposureLimitTable.All.Count, rows.Count);
        for (int i = 0; i < rows.Count; i++)
        {
            var limit = ExposureLimitTable.All[i];
            Assert.Contains(limit.Unit, rows[i].TextContent, StringComparison.Ordinal);
            Assert.Contains(limit.Averaging, rows[i].TextContent, StringComparison.Ordinal);
            Assert.Contains(limit.Year, rows[i].TextContent, StringComparison.Ordinal);
        }
        // CONFIRMED: NIOSH Pocket Guide npgd0040, 1 ppm arsine = 3.19 mg/m³, so 0.05 ppm ≈ 0.16 mg/m³.
        Assert.Contains("≈ 0.159 mg/m³", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_Coverage_EachChamberAndRuleWatchedShowingOrNotWatched()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<SafetyPage>();

        var rows = page.FindAll("[data-testid=coverage-row]");
        string Status(string chamber, string rule) =>
            rows.Single(r => r.GetAttribute("data-chamber") == chamber && r.GetAttribute("data-rule") == rule).TextContent;

        Assert.Equal(2 * DefaultReminders.All.Count, rows.Count);
        Assert.Contains("SHOWING NOW", Status("north-1", "arsenic-source-hot"), StringComparison.Ordinal);
        Assert.Contains("as_cell_tc", Status("north-1", "arsenic-source-hot"), StringComparison.Ordinal);
        Assert.Contains("NOT WATCHED ON THIS CHAMBER", Status("north-1", "hydride-flowing"), StringComparison.Ordinal);
        Assert.Contains("no channel has the role HydrideFlow", Status("north-1", "hydride-flowing"), StringComparison.Ordinal);
        Assert.Contains("WATCHED", Status("north-1", "cryopanel-filling"), StringComparison.Ordinal);
        Assert.DoesNotContain("NOT WATCHED", Status("north-1", "cryopanel-filling"), StringComparison.Ordinal);
    }
}
