using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Decoding;

public sealed class GrayImageDecoderTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private string Gradient(string name = "g.png")
    {
        var pixels = new ushort[64 * 48];
        for (int i = 0; i < pixels.Length; i++)
        {
            pixels[i] = (ushort)(i * 13);
        }
        string path = _folder.File(name);
        TestImages.WritePng16(path, pixels, 64, 48);
        return path;
    }

    [Fact]
    public void Decode_Png16_KeepsEveryValue()
    {
        GrayImage image = GrayImageDecoder.Decode(Gradient());
        Assert.Equal((64, 48), (image.Width, image.Height));
        Assert.Equal((ushort)(100 * 13), image.Pixels[100]);
        Assert.Equal("PNG", image.SourceFormat);
    }

    [Theory]
    [InlineData("jpg")]
    [InlineData("bmp")]
    [InlineData("png")]
    public void Decode_EightBitFormats_GivesSixteenBitScale(string extension)
    {
        string path = _folder.File("flat." + extension);
        using (var image = new SixLabors.ImageSharp.Image<SixLabors.ImageSharp.PixelFormats.L8>(32, 24, new SixLabors.ImageSharp.PixelFormats.L8(200)))
        {
            SixLabors.ImageSharp.ImageExtensions.Save(image, path);
        }
        GrayImage decoded = GrayImageDecoder.Decode(path);
        // 8-bit 200 on the 16-bit scale is 200 · 257 = 51400 (DERIVED); JPEG may round by a level.
        Assert.All(decoded.Pixels, v => Assert.InRange(v, 199 * 257, 201 * 257));
    }

    [Fact]
    public void Decode_ZeroLengthFile_SaysEmpty()
    {
        string path = _folder.File("empty.tif");
        File.WriteAllBytes(path, []);
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        Assert.Equal(ImageDecodeFailure.Empty, ex.Failure);
        Assert.Contains("empty.tif", ex.Message);
    }

    [Fact]
    public void Decode_TruncatedPng_SaysDamaged()
    {
        string path = Gradient("cut.png");
        byte[] bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(bytes.Length / 2)]);
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        Assert.Equal(ImageDecodeFailure.Corrupt, ex.Failure);
        Assert.Contains("cut.png", ex.Message);
    }

    [Theory]
    [InlineData("png", 0.9)]
    [InlineData("png", 0.5)]
    [InlineData("jpg", 0.7)]
    [InlineData("bmp", 0.8)]
    public void Decode_TruncatedLargerImage_SaysTruncated(string extension, double keep)
    {
        // A field-sized image whose decoder would otherwise fill the missing rows with zeros.
        string path = _folder.File("field." + extension);
        var pixels = new ushort[400 * 300];
        var random = new Random(3);
        for (int i = 0; i < pixels.Length; i++)
        {
            pixels[i] = (ushort)random.Next(0, 65536);
        }
        using (var image = SixLabors.ImageSharp.Image.LoadPixelData<SixLabors.ImageSharp.PixelFormats.L16>(
            System.Runtime.InteropServices.MemoryMarshal.Cast<ushort, SixLabors.ImageSharp.PixelFormats.L16>(pixels.AsSpan()), 400, 300))
        {
            SixLabors.ImageSharp.ImageExtensions.Save(image, path);
        }
        byte[] bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(int)(bytes.Length * keep)]);
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        Assert.Equal(ImageDecodeFailure.Corrupt, ex.Failure);
        Assert.Contains("truncated", ex.Message);
    }

    [Fact]
    public void Decode_TruncatedTiff_SaysDamaged()
    {
        string path = _folder.File("cut.tif");
        ReferenceTiff.Write(path, "I;16", 0, 0, 0);
        byte[] bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..(bytes.Length / 3)]);
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        Assert.Contains("cut.tif", ex.Message);
    }

    [Fact]
    public void Decode_PngNamedTif_DecodesByContent()
    {
        string png = Gradient();
        string path = _folder.File("really-a-png.tif");
        File.Copy(png, path);
        Assert.Equal("PNG", GrayImageDecoder.Decode(path).SourceFormat);
    }

    [Fact]
    public void Decode_TextNamedPng_SaysUnsupported()
    {
        string path = _folder.File("notes.png");
        File.WriteAllText(path, "field notes, not an image");
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        Assert.Equal(ImageDecodeFailure.UnsupportedFormat, ex.Failure);
    }

    [Fact]
    public void Decode_MissingFile_SaysNotFound()
    {
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(_folder.File("nothing.png")));
        Assert.Equal(ImageDecodeFailure.NotFound, ex.Failure);
    }

    [Fact]
    public void Decode_PngHeaderClaimingTenGigapixels_IsRefusedBeforeDecoding()
    {
        string path = _folder.File("huge.png");
        File.WriteAllBytes(path, TestImages.PngHeaderOnly(100_000, 100_000));
        long before = GC.GetAllocatedBytesForCurrentThread();
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.Equal(ImageDecodeFailure.TooManyPixels, ex.Failure);
        Assert.Contains("100,000 × 100,000", ex.Message);
        Assert.True(allocated < 16 << 20, $"refusing the header allocated {allocated:N0} bytes");
    }

    [Fact]
    public void Decode_BmpHeaderClaimingGigapixels_IsRefused()
    {
        string path = _folder.File("huge.bmp");
        File.WriteAllBytes(path, TestImages.BmpHeaderOnly(60_000, 60_000));
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));
        Assert.True(ex.Failure == ImageDecodeFailure.TooManyPixels, ex.Message);
    }

    [Fact]
    public void Decode_OverConfiguredLimits_IsRefused()
    {
        string path = Gradient();
        Assert.Equal(ImageDecodeFailure.TooManyPixels,
            Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path, new ImageLimits { MaxPixels = 1000 })).Failure);
        Assert.Equal(ImageDecodeFailure.FileTooLarge,
            Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path, new ImageLimits { MaxFileBytes = 100 })).Failure);
    }

    [Theory]
    [InlineData((ushort)0)]
    [InlineData((ushort)65535)]
    public void Analyze_UniformImage_ReportsNoWires(ushort value)
    {
        string path = _folder.File($"uniform-{value}.png");
        TestImages.WriteUniform(path, 200, 150, value);
        FieldAnalysis analysis = FieldAnalyzer.Analyze(path);
        Assert.True(analysis.NoWiresFound);
        Assert.Contains("no wires were found", analysis.Notes);
        Assert.Equal(0, analysis.Statistics.ObjectsFound);
    }

    [Fact]
    public void Analyze_OnePixelImage_ReportsNoWires()
    {
        string path = _folder.File("one.png");
        TestImages.WriteUniform(path, 1, 1, 1234);
        FieldAnalysis analysis = FieldAnalyzer.Analyze(path);
        Assert.True(analysis.NoWiresFound);
        Assert.Equal((1, 1), (analysis.Width, analysis.Height));
    }
}
