using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Measurement;

/// <summary>
/// Discs and regular hexagons at sub-pixel positions, measured through the whole pipeline with flattening and
/// denoising off. Tolerances (DERIVED from the pixel grid):
/// - Feret: the union of inside pixels reaches at most √2/2 px beyond the true outline and misses at most √2/2 px
///   of it on each side, so a caliper width is within √2 px.
/// - Area: along a straight edge of length ℓ the pixel-centre count is off by at most about ½·ℓ (half a pixel per
///   unit length in the worst alignment), plus a pixel per corner: |ΔA| ≤ ½·P + n_corners px².
/// </summary>
public sealed class ShapeMeasurementTests
{
    private static readonly FieldAnalysisOptions Plain = new() { BackgroundWindowPixels = 0, DenoiseRadius = 0, DetectInfoStrip = false };

    public static TheoryData<double, double, double, double> Hexagons()
    {
        var data = new TheoryData<double, double, double, double>();
        var random = new Random(5);
        for (int rotation = 0; rotation < 60; rotation += 7)
        {
            data.Add(12 + 10 * random.NextDouble(), 60 + random.NextDouble(), 60 + random.NextDouble(), rotation + random.NextDouble());
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Hexagons))]
    public void Measure_RegularHexagon_MatchesClosedForms(double a, double cx, double cy, double rotationDeg)
    {
        GrayImage image = Shapes.Draw(120, 120, (x, y) => Shapes.InHexagon(x, y, cx, cy, a, rotationDeg));
        WireMeasurement wire = Assert.Single(FieldAnalyzer.AnalyzeWithRaster(image, "hexagon", null, Plain).Analysis.Wires);

        // DERIVED (CHECKS.md §6): area (3√3/2)a², min Feret √3·a (flat to flat), max Feret 2a (corner to corner),
        // equivalent radius √(A/π) = 0.909392a, circularity 0.9069.
        double area = 1.5 * Math.Sqrt(3) * a * a;
        double areaTolerance = 0.5 * 6 * a + 6;
        Assert.InRange(wire.AreaPixels, area - areaTolerance, area + areaTolerance);
        Assert.InRange(wire.MinFeret, Math.Sqrt(3) * a - Math.Sqrt(2), Math.Sqrt(3) * a + Math.Sqrt(2));
        Assert.InRange(wire.MaxFeret, 2 * a - Math.Sqrt(2), 2 * a + Math.Sqrt(2));
        double radiusTolerance = areaTolerance / (2 * Math.PI * 0.909392 * a);
        Assert.InRange(wire.EquivalentRadius, 0.909392 * a - radiusTolerance, 0.909392 * a + radiusTolerance);
        // COMMON PRACTICE: the centroid of a digitised convex shape of this size is within a fraction of a pixel.
        Assert.InRange(wire.CentroidX, cx - 0.3, cx + 0.3);
        Assert.InRange(wire.CentroidY, cy - 0.3, cy + 0.3);
        Assert.Equal(WireClass.Vertical, wire.Class);
    }

    [Theory]
    [InlineData(5.3, 30.2, 31.7)]
    [InlineData(9.75, 40.5, 39.9)]
    [InlineData(17.1, 50.33, 49.61)]
    public void Measure_Disc_MatchesClosedForms(double r, double cx, double cy)
    {
        GrayImage image = Shapes.Draw(100, 100, (x, y) => (x - cx) * (x - cx) + (y - cy) * (y - cy) <= r * r);
        WireMeasurement wire = Assert.Single(FieldAnalyzer.AnalyzeWithRaster(image, "disc", null, Plain).Analysis.Wires);
        // DERIVED: a disc's every caliper width is 2r; a circle has no corners, |ΔA| ≤ ½·2πr.
        double areaTolerance = 0.5 * 2 * Math.PI * r + 2;
        Assert.InRange(wire.AreaPixels, Math.PI * r * r - areaTolerance, Math.PI * r * r + areaTolerance);
        Assert.InRange(wire.EquivalentRadius, r - areaTolerance / (2 * Math.PI * r), r + areaTolerance / (2 * Math.PI * r));
        Assert.InRange(wire.MinFeret, 2 * r - Math.Sqrt(2), 2 * r + Math.Sqrt(2));
        Assert.InRange(wire.MaxFeret, 2 * r - Math.Sqrt(2), 2 * r + Math.Sqrt(2));
        Assert.InRange(wire.Circularity, 0.85, 1.1);
    }

    [Fact]
    public void Measure_HexagonsOverAllRotations_MeanAreaErrorIsSmall()
    {
        // The per-shape bound above is loose; averaged over random sub-pixel placements the counting error
        // cancels (the pixel-centre count is an unbiased area estimator, COMMON PRACTICE), so the mean relative
        // error of 40 hexagons of side 15 px stays far below the single-shape bound (about 8 %).
        var random = new Random(17);
        double sum = 0;
        const double A = 15;
        for (int k = 0; k < 40; k++)
        {
            double cx = 40 + random.NextDouble(), cy = 40 + random.NextDouble(), rot = random.NextDouble() * 60;
            GrayImage image = Shapes.Draw(80, 80, (x, y) => Shapes.InHexagon(x, y, cx, cy, A, rot));
            WireMeasurement wire = Assert.Single(FieldAnalyzer.AnalyzeWithRaster(image, "hexagon", null, Plain).Analysis.Wires);
            sum += wire.AreaPixels / (1.5 * Math.Sqrt(3) * A * A) - 1;
        }
        Assert.InRange(sum / 40, -0.01, 0.01);
    }
}
