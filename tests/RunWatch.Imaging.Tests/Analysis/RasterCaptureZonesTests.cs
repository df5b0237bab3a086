using System.Runtime.InteropServices;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Segmentation;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using RunWatch.Testing.Reference;
using Xunit;

namespace RunWatch.Imaging.Tests.Analysis;

/// <summary>
/// Edge-based capture zones against SciPy: scipy.ndimage.distance_transform_edt(labels == 0, return_indices=True)
/// (Debian python3-scipy) on the same label image, through tests/reference/imaging_edt_zones.py.
/// COMMON PRACTICE (an independent exact EDT as the reference).
/// </summary>
public sealed class RasterCaptureZonesTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Compute_GeneratedField_AgreesWithScipyFeatureTransform()
    {
        SemField field = Fields.Standard(31, 512, 400, 300, strip: 24);
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        (FieldAnalysis analysis, FieldRaster raster) = FieldAnalyzer.AnalyzeWithRaster(image, "zones", new FieldSidecar { PixelSizeNm = 5 },
            new FieldAnalysisOptions { DiffusionLengthNm = 60, KeepZoneMap = true });
        int w = field.Width, h = field.Height, n = w * h;
        int[] labels = raster.Labels;
        string labelPath = _folder.File("labels.png");
        TestImages.WritePng16(labelPath, labels.Select(l => (ushort)l).ToArray(), w, h);
        string prefix = _folder.File("scipy");
        ReferencePython.Run("imaging_edt_zones.py", labelPath, prefix);
        int[] scipyD2 = MemoryMarshal.Cast<byte, int>(File.ReadAllBytes(prefix + ".d2")).ToArray();
        int[] scipyIdx = MemoryMarshal.Cast<byte, int>(File.ReadAllBytes(prefix + ".idx")).ToArray();

        var d2 = new int[n];
        var nearest = new int[n];
        DistanceTransform.Compute(labels, w, h, d2, nearest);
        Assert.Equal(scipyD2, d2);

        // Zones from SciPy's nearest pixels, L = 60 nm / 5 nm = 12 px, rows above the band only.
        double l2 = 12.0 * 12.0;
        int validH = raster.ValidHeight;
        var scipyAreas = new long[analysis.Wires.Count + 1];
        int ties = 0;
        for (int i = 0; i < w * validH; i++)
        {
            if (labels[i] != 0 || scipyD2[i] > l2)
            {
                continue;
            }
            int theirs = labels[scipyIdx[i]];
            scipyAreas[theirs]++;
            int ours = raster.ZoneMap![i];
            if (ours != theirs)
            {
                // Allowed only where the pixel is equally near both wires (a genuine tie).
                Assert.Equal(scipyD2[i], d2[i]);
                int fx = nearest[i] % w - i % w, fy = nearest[i] / w - i / w;
                Assert.Equal(scipyD2[i], fx * fx + fy * fy);
                ties++;
            }
        }
        long ourTotal = analysis.Wires.Sum(wire => (long)Math.Round(wire.EdgeZoneArea!.Value / 25));
        Assert.Equal(scipyAreas.Sum(), ourTotal);
        Assert.True(ties < 0.01 * ourTotal, $"{ties} tie pixels of {ourTotal}");
        foreach (var wire in analysis.Wires)
        {
            double ours = wire.EdgeZoneArea!.Value / 25;
            Assert.InRange(ours, scipyAreas[wire.Id] - ties, scipyAreas[wire.Id] + ties);
        }
    }
}
