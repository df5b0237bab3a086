using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Decoding;

/// <summary>
/// TIFF files from Pillow with the TIFF 6.0 resolution tags (XResolution 282, YResolution 283, ResolutionUnit 296:
/// 2 = inch, 3 = centimetre; CONFIRMED: TIFF Revision 6.0, Adobe 1992, section 8 — FROM MEMORY for the section
/// number). Expected pixel sizes are DERIVED: 1 inch = 25.4 mm exactly, so size_nm = 2.54e7 / (px per inch) or
/// 1e7 / (px per cm).
/// </summary>
public sealed class TiffResolutionTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData("I;16", 254000.0, 3, 39.37007874)]
    [InlineData("I;16", 1.0e6, 2, 25.4)]
    [InlineData("L", 400000.0, 3, 25.0)]
    [InlineData("RGB", 2540000.0, 2, 10.0)]
    public void Decode_PillowTiffWithResolution_GivesPixelSize(string mode, double resolution, int unit, double expectedNm)
    {
        string path = _folder.File("field.tif");
        ReferenceTiff.Write(path, mode, resolution, resolution, unit);
        GrayImage image = GrayImageDecoder.Decode(path);
        FieldScale scale = ScaleResolver.Resolve(null, null, image.Resolution);
        Assert.Equal(ScaleSource.TiffResolution, scale.Source);
        Assert.Equal(expectedNm, scale.PixelSizeNm!.Value, 6);
    }

    [Fact]
    public void Decode_Pillow16BitTiff_KeepsValues()
    {
        string path = _folder.File("ramp16.tif");
        ReferenceTiff.Write(path, "I;16", 0, 0, 0);
        GrayImage image = GrayImageDecoder.Decode(path);
        // The writer's ramp: value = 1000·x + 10·y.
        Assert.Equal((ushort)(1000 * 5 + 10 * 3), image.Pixels[3 * 64 + 5]);
        Assert.Equal("TIFF", image.SourceFormat);
    }

    [Fact]
    public void Decode_Pillow8BitTiff_ScalesTo16Bit()
    {
        string path = _folder.File("ramp8.tif");
        ReferenceTiff.Write(path, "L", 0, 0, 0);
        GrayImage image = GrayImageDecoder.Decode(path);
        int expected8 = (1000 * 5 + 10 * 3) / 256;
        Assert.Equal(expected8 * 257, image.Pixels[3 * 64 + 5]);
    }

    [Fact]
    public void Decode_TiffWithoutUnit_HasNoScaleAndSaysWhy()
    {
        string path = _folder.File("nounit.tif");
        ReferenceTiff.Write(path, "I;16", 300000, 300000, 1);
        FieldScale scale = ScaleResolver.Resolve(null, null, GrayImageDecoder.Decode(path).Resolution);
        Assert.False(scale.HasScale);
        Assert.Contains("no absolute unit", scale.Note);
    }

    [Fact]
    public void Decode_TiffAtScreenDefault72Dpi_IsNotTakenAsScale()
    {
        string path = _folder.File("dpi72.tif");
        ReferenceTiff.Write(path, "I;16", 72, 72, 2);
        FieldScale scale = ScaleResolver.Resolve(null, null, GrayImageDecoder.Decode(path).Resolution);
        Assert.False(scale.HasScale);
        Assert.Contains("not an SEM scale", scale.Note);
    }

    [Fact]
    public void Decode_PillowRgbTiff_ReducesToLuminance()
    {
        // The writer puts the same 8-bit value in R, G and B, so any luminance weights summing to 1
        // (ImageSharp uses ITU-R BT.709) give that value, scaled to 16 bit by 257 (DERIVED).
        string path = _folder.File("rgb.tif");
        ReferenceTiff.Write(path, "RGB", 0, 0, 0);
        GrayImage image = GrayImageDecoder.Decode(path);
        int expected8 = (1000 * 20 + 10 * 7) / 256;
        Assert.InRange(image.Pixels[7 * 64 + 20], expected8 * 257 - 1, expected8 * 257 + 1);
    }
}
