using RunWatch.Core.Wafers;
using Xunit;

namespace RunWatch.Core.Tests.Wafers;

/// <summary>Droplet figures on a worked example: every mean recomputed by hand from the listed wires.</summary>
public sealed class DropletFiguresTests
{
    [Fact]
    public void From_MixedWires_CountsAndAveragesOnlyInteriorVerticalWiresWithDroplets()
    {
        FieldWire[] wires =
        [
            new(1, 0, 0, 30, Vertical: true, Interior: true, ZoneNormalised: null, DropletRadiusNm: 20),   // droplet on a visible facet
            new(2, 0, 0, 34, Vertical: true, Interior: true, ZoneNormalised: null, DropletRadiusNm: 22),
            new(3, 0, 0, 33, Vertical: true, Interior: true, ZoneNormalised: null, DropletRadiusNm: 41),   // droplet hides the facet, θ known
            new(4, 0, 0, double.NaN, Vertical: true, Interior: true, ZoneNormalised: null, DropletRadiusNm: 44), // droplet only, θ unknown
            new(5, 0, 0, 31, Vertical: true, Interior: true, ZoneNormalised: null),                        // no droplet
            new(6, 0, 0, 29, Vertical: true, Interior: false, ZoneNormalised: null, DropletRadiusNm: 21),  // touches the border
            new(7, 0, 0, 60, Vertical: false, Interior: true, ZoneNormalised: null, DropletRadiusNm: 50),  // not vertical
        ];

        DropletFigures f = DropletFigures.From(wires);

        Assert.Equal(4, f.WithDroplet);
        Assert.Equal(3, f.WithBoth);
        Assert.Equal((30 + 34 + 33) / 3.0, f.MeanWireRadiusNm, 12);
        Assert.Equal((20 + 22 + 41) / 3.0, f.MeanDropletRadiusNm, 12);
        Assert.Equal(44, f.MeanDropletOnlyRadiusNm, 12);
    }

    [Fact]
    public void From_NoDroplets_CountsZeroAndMeansAreNaN()
    {
        DropletFigures f = DropletFigures.From([new FieldWire(1, 0, 0, 30, true, true, null)]);

        Assert.Equal(0, f.WithDroplet);
        Assert.True(double.IsNaN(f.MeanWireRadiusNm) && double.IsNaN(f.MeanDropletRadiusNm) && double.IsNaN(f.MeanDropletOnlyRadiusNm));
    }
}
