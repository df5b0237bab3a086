using System.Text.Json;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Testing.Reference;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Measurement;

/// <summary>
/// Radius at the sub-pixel edge on shapes drawn by scikit-image (skimage.draw.polygon / disk on an 8× grid, areas from
/// skimage.measure.regionprops, blurred by skimage.filters.gaussian) through tests/reference/imaging_blurred_shapes.py.
/// Without rims the half-maximum of a Gaussian-blurred edge lies on the edge (erf profile, DERIVED); the curved outline's
/// half-level contour moves in by σ²κ/2, which the blur correction restores.
/// </summary>
public sealed class SkimageBlurredShapeTests(ITestOutputHelper output) : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData(0.7, 5)]
    [InlineData(1.0, 6)]
    [InlineData(1.5, 7)]
    public void EdgeRadius_SkimageBlurredShapes_MatchRegionpropsArea(double sigma, int seed)
    {
        string path = _folder.File($"shapes-{seed}.png");
        using JsonDocument reference = JsonDocument.Parse(ReferencePython.Run("imaging_blurred_shapes.py", path,
            sigma.ToString(System.Globalization.CultureInfo.InvariantCulture), seed.ToString(System.Globalization.CultureInfo.InvariantCulture)));
        GrayImage image = GrayImageDecoder.Decode(path);
        FieldAnalysis a = FieldAnalyzer.AnalyzeWithRaster(image, "skimage", null, new FieldAnalysisOptions { DetectInfoStrip = false }).Analysis;
        var errors = new List<(double R, double Err)>();
        foreach (JsonElement s in reference.RootElement.GetProperty("shapes").EnumerateArray())
        {
            double x = s.GetProperty("x").GetDouble(), y = s.GetProperty("y").GetDouble(), area = s.GetProperty("area").GetDouble();
            var w = a.Wires.Single(w => Math.Abs(w.CentroidX - x) < 1 && Math.Abs(w.CentroidY - y) < 1);
            double r = Math.Sqrt(area / Math.PI);
            errors.Add((r, (w.EquivalentRadius / r) - 1));
        }
        double[] sorted = errors.Select(e => Math.Abs(e.Err)).OrderBy(v => v).ToArray();
        output.WriteLine($"σ {sigma}: fitted blur {a.EdgeSigmaPixels:0.000} px, rim offset {a.EdgeOffsetPixels:+0.000;-0.000} px; {errors.Count} shapes, median |error| {sorted[sorted.Length / 2]:0.00%}, max {sorted[^1]:0.00%}; " +
            $"r < 8 px median error {errors.Where(e => e.R < 8).Select(e => e.Err).OrderBy(v => v).ElementAt(errors.Count(e => e.R < 8) / 2):+0.00%;-0.00%}");
        Assert.Equal(reference.RootElement.GetProperty("shapes").GetArrayLength(), errors.Count);
        // The image also averages over each pixel (a 1-px box adds 1/12 px² of variance, DERIVED); the rim-free fit may
        // trade a little σ against its offset, so σ is bounded, the radii are what is checked.
        double effective = Math.Sqrt((sigma * sigma) + (1.0 / 12));
        Assert.InRange(a.EdgeSigmaPixels, effective * 0.97, effective * 1.25);
        Assert.InRange(sorted[sorted.Length / 2], 0, 0.01);
        Assert.InRange(sorted[^1], 0, 0.04);
    }
}
