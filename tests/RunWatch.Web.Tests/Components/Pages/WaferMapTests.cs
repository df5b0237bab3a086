using Bunit;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Pages;

/// <summary>The wafer map: fields at their stored positions, field verdicts, the radial trend and the uniformity figure.</summary>
public sealed class WaferMapTests
{
    [Fact]
    public void Render_PlacedFields_TilesLinkToTheirFieldOnTheWaferPage()
    {
        using var ctx = new DashboardTestContext();
        LabRecordsFactory.SeedMap(ctx.Records);
        var page = ctx.Render<WaferMap>(p => p.Add(x => x.WaferId, "W-MAP-1"));

        var tiles = page.FindAll("[data-testid=map-field]");
        Assert.Equal(3, tiles.Count);
        Assert.Equal(["wafers/W-MAP-1#field-11", "wafers/W-MAP-1#field-12", "wafers/W-MAP-1#field-13"], tiles.Select(t => t.GetAttribute("href")));
        // Means 28, 30, 40 nm written in the tiles (DERIVED: the mean of each field's three radii).
        Assert.Equal(["28.0", "30.0", "40.0"], tiles.Select(t => t.QuerySelector(".tile-value")!.TextContent));
        // (−20, 0) mm on a 50.8 mm outline: x = 260 − 20 · 225 / 25.4 = 82.83 px, minus half the 46 px tile.
        Assert.Equal("59.83", tiles[0].QuerySelector("rect")!.GetAttribute("x"));
        Assert.Contains("outline Ø 50.8 mm", page.Markup, StringComparison.Ordinal);
        Assert.Equal("wafers/W-MAP-1", page.Find("[data-testid=map-wafer-link]").GetAttribute("href"));
    }

    [Fact]
    public void Render_Uniformity_HalfRangeOverMeanAndRadialSlope()
    {
        using var ctx = new DashboardTestContext();
        LabRecordsFactory.SeedMap(ctx.Records);
        var page = ctx.Render<WaferMap>(p => p.Add(x => x.WaferId, "W-MAP-1"));

        // Field means 28, 30, 40: U = (40 − 28) / (2 · 32.667) = 18.4 % (DERIVED by hand).
        Assert.Equal("18.4 %", page.Find("[data-testid=non-uniformity]").TextContent.Trim());
        // Distances 20, 0, 11.18 mm (mean 10.393): the least-squares slope is Σ(dx·dy)/Σdx²
        // = (9.607·−4.667 + −10.393·−2.667 + 0.787·7.333)/(92.29 + 108.02 + 0.62) = −0.0565 nm/mm (DERIVED by hand).
        Assert.Equal("−0.056 nm/mm", page.Find("[data-testid=radial-slope]").TextContent.Trim());
        Assert.Equal(3, page.FindAll("[data-testid=radial-point]").Count);
        Assert.Single(page.FindAll("[data-testid=radial-fit]"));
    }

    [Fact]
    public void Render_FieldVerdicts_FromRecipeLimits_UnplacedFieldListed()
    {
        using var ctx = new DashboardTestContext();
        LabRecordsFactory.SeedMap(ctx.Records);
        var page = ctx.Render<WaferMap>(p => p.Add(x => x.WaferId, "W-MAP-1"));

        var rows = page.FindAll("[data-testid=map-field-row]");
        Assert.Equal(4, rows.Count);
        // Target 30 ± 8 nm (warn ± 3): 28 → pass, 30 → pass, 40 → fail; the wafer's 100-wire minimum is not a field rule.
        Assert.Contains("● PASS", rows[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("■ FAIL", rows[2].TextContent, StringComparison.Ordinal);
        Assert.Contains("mean radius", rows[2].TextContent, StringComparison.Ordinal);
        Assert.Contains("no position recorded", rows[3].TextContent, StringComparison.Ordinal);
        Assert.DoesNotContain("NaN", page.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void ChooseDensity_TilesShowDensityPerSquareMicrometre()
    {
        using var ctx = new DashboardTestContext();
        LabRecordsFactory.SeedMap(ctx.Records);
        var page = ctx.Render<WaferMap>(p => p.Add(x => x.WaferId, "W-MAP-1"));

        page.Find("[data-testid=figure-density]").Change("density");

        // 4 objects (3 counted + 1 tilted) on 24 µm²: 0.17 µm⁻² (DERIVED).
        Assert.Equal("0.17", page.FindAll("[data-testid=map-field]")[0].QuerySelector(".tile-value")!.TextContent);
    }

    [Fact]
    public void Render_UnknownWafer_SaysSo()
    {
        using var ctx = new DashboardTestContext();
        var page = ctx.Render<WaferMap>(p => p.Add(x => x.WaferId, "W-NONE"));
        Assert.Contains("No wafer W-NONE", page.Find("[data-testid=no-wafer-map]").TextContent, StringComparison.Ordinal);
    }
}
