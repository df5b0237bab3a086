using Bunit;
using RunWatch.Core.Wafers;
using RunWatch.Web.Components.Shared;
using RunWatch.Web.Data;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Shared;

/// <summary>The wafer page's droplet table (invented figures).</summary>
public sealed class WaferDropletTableTests
{
    [Fact]
    public void Render_WithDroplets_ShowsWaferAndFieldWireAndDropletRadius()
    {
        using var ctx = new DashboardTestContext();
        var droplets = new WaferDroplets(new DropletFigures(9, 7, 31.24, 40.06, 45.5),
            [new FieldDroplets("W-1_field01.png", new DropletFigures(5, 5, 30.5, 39.1, double.NaN)), new FieldDroplets("W-1_field02.png", new DropletFigures(4, 2, 32.2, 41.0, 45.5))]);

        var table = ctx.Render<WaferDropletTable>(p => p.Add(t => t.Droplets, droplets));

        string wafer = table.Find("[data-testid=droplet-wafer]").TextContent;
        Assert.Contains("31.2 nm", wafer, StringComparison.Ordinal);
        Assert.Contains("40.1 nm", wafer, StringComparison.Ordinal);
        Assert.Contains("2 (mean 45.5 nm)", wafer, StringComparison.Ordinal);
        var rows = table.FindAll("[data-testid=droplet-field]");
        Assert.Equal(2, rows.Count);
        Assert.Contains("W-1_field02.png", rows[1].TextContent, StringComparison.Ordinal);
        Assert.Contains("32.2 nm", rows[1].TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_NoDroplets_ShowsNothing()
    {
        using var ctx = new DashboardTestContext();

        var table = ctx.Render<WaferDropletTable>(p => p.Add(t => t.Droplets, null));

        Assert.Empty(table.FindAll("[data-testid=droplet-table]"));
    }
}
