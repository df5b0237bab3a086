using RunWatch.Imaging.Overlay;
using RunWatch.Imaging.Tests.Support;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using Xunit;

namespace RunWatch.Imaging.Tests.Overlay;

/// <summary>The viewer's plain PNG of a 16-bit TIFF written by Pillow, read back with ImageSharp's PNG decoder.</summary>
public sealed class PlainFieldPngTests
{
    [Fact]
    public void Render_Pillow16BitTiffRamp_FullSizeGreyPngStretchedMonotone()
    {
        using var folder = new TempFolder();
        string path = Path.Combine(folder.Path, "ramp.tif");
        // 64 × 48 ramp, value = 1000·x + 10·y (tests/reference/imaging_write_tiff.py).
        ReferenceTiff.Write(path, "I;16", 0, 0, 0);

        byte[] png = PlainFieldPng.Render(path);

        using var image = Image.Load<L8>(png);
        Assert.Equal((64, 48), (image.Width, image.Height));
        for (int x = 1; x < 64; x++)
        {
            Assert.True(image[x, 20].PackedValue >= image[x - 1, 20].PackedValue, $"column {x} darker than column {x - 1}");
        }
        Assert.Equal(0, image[0, 0].PackedValue);
        Assert.Equal(255, image[63, 47].PackedValue);
        // Linear stretch between the 1st and 99th percentiles (about 630 and 63 300 here, DERIVED from the ramp):
        // the middle column (≈ 32 235) maps to about 128.
        Assert.InRange(image[32, 24].PackedValue, 122, 134);
    }
}
