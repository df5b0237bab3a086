using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Segmentation;

public sealed class ComponentSplitterTests
{
    private static readonly FieldAnalysisOptions Plain = new() { BackgroundWindowPixels = 0, DenoiseRadius = 0, DetectInfoStrip = false };

    [Theory]
    [InlineData(1.6)]
    [InlineData(1.8)]
    [InlineData(2.0)]
    public void Analyze_TwoTouchingHexagons_SplitsIntoTwo(double centreDistanceOverSide)
    {
        // DERIVED: two hexagons of side a whose centres are d apart along a flat-normal direction overlap in a
        // neck narrower than the flat-to-flat width √3·a, so the distance transform has two peaks.
        const double A = 10;
        double d = centreDistanceOverSide * A;
        GrayImage image = Shapes.Draw(100, 80, (x, y) =>
            Shapes.InHexagon(x, y, 50 - d / 2, 40.3, A, 30) || Shapes.InHexagon(x, y, 50 + d / 2, 40.3, A, 30));
        var wires = FieldAnalyzer.AnalyzeWithRaster(image, "pair", null, Plain).Analysis.Wires;
        Assert.Equal(2, wires.Count);
        Assert.All(wires, w => Assert.True(w.Split));
        double hexagon = 1.5 * Math.Sqrt(3) * A * A;
        Assert.InRange(wires.Sum(w => w.AreaPixels), 0.8 * 2 * hexagon, 2 * hexagon + 40);
        Assert.InRange(Math.Abs(wires[0].CentroidX - wires[1].CentroidX), d - 2, d + 2);
    }

    [Fact]
    public void Analyze_SingleElongatedStadium_StaysOneObject()
    {
        // A tilted wire seen side-on: one ridge in the distance transform, whose digitisation ripples are far below h.
        GrayImage image = Shapes.Draw(120, 60, (x, y) =>
        {
            double t = Math.Clamp((x - 60) * 0.94 + (y - 30) * 0.34, -25, 25);
            double ex = x - 60 - t * 0.94, ey = y - 30 - t * 0.34;
            return ex * ex + ey * ey <= 36;
        });
        var wire = Assert.Single(FieldAnalyzer.AnalyzeWithRaster(image, "stadium", null, Plain).Analysis.Wires);
        Assert.Equal(RunWatch.Imaging.Measurement.WireClass.Elongated, wire.Class);
        Assert.False(wire.Split);
    }
}
