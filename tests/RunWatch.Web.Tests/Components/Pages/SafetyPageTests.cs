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
}
