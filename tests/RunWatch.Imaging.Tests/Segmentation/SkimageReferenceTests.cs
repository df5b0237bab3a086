using System.Text.Json;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Segmentation;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using RunWatch.Testing.Reference;
using Xunit;

namespace RunWatch.Imaging.Tests.Segmentation;

/// <summary>
/// Otsu threshold and 8-connected labelling against scikit-image (Debian python3-skimage:
/// skimage.filters.threshold_otsu, skimage.measure.label(connectivity=2)) on generated fields, through
/// tests/reference/imaging_skimage_check.py. COMMON PRACTICE (an independent implementation as the reference).
/// </summary>
public sealed class SkimageReferenceTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData(21, true)]
    [InlineData(22, true)]
    [InlineData(23, false)]
    public void OtsuAndLabels_GeneratedField_EqualScikitImage(int seed, bool preprocess)
    {
        SemField field = Fields.Standard(seed, 640, 480, 420, strip: 32);
        int validH = field.Height - field.InfoStripRows;
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        ushort[] input = preprocess
            ? FieldAnalyzer.Preprocess(image, validH, new FieldAnalysisOptions(), out _)
            : field.Pixels[..(field.Width * validH)];
        string path = _folder.File($"pre-{seed}.png");
        TestImages.WritePng16(path, input, field.Width, validH);

        int threshold = OtsuThreshold.Compute(input);
        var labels = new int[input.Length];
        int components = ConnectedLabeling.Label(input, field.Width, validH, threshold, labels, out _);

        using JsonDocument reference = JsonDocument.Parse(ReferencePython.Run("imaging_skimage_check.py", path));
        Assert.Equal(reference.RootElement.GetProperty("threshold").GetInt32(), threshold);
        Assert.Equal(reference.RootElement.GetProperty("components").GetInt32(), components);
        Assert.Equal(reference.RootElement.GetProperty("foreground").GetInt32(), input.Count(v => v > threshold));
        Assert.True(components > 200, $"only {components} components: the fixture is too easy to test labelling");
    }
}
