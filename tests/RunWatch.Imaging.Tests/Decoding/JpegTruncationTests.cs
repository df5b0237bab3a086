using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Testing.Reference;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Formats.Jpeg;
using SixLabors.ImageSharp.PixelFormats;
using Xunit;

namespace RunWatch.Imaging.Tests.Decoding;

/// <summary>
/// A JPEG cut inside its entropy-coded scan with an end-of-image marker (FF D9) appended looks complete to a marker
/// check and decodes with the missing blocks filled in. Real JPEGs, written by libjpeg (OpenCV, tests/reference) and
/// by ImageSharp's encoder, are cut at several points of their scan data and closed with FF D9: each must be refused
/// as truncated; the uncut files (baseline grey and colour, restart markers, progressive) still decode.
/// </summary>
public sealed class JpegTruncationTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Theory]
    [InlineData("gray", 0.10)]
    [InlineData("gray", 0.50)]
    [InlineData("gray", 0.97)]
    [InlineData("colour", 0.35)]
    [InlineData("colour", 0.90)]
    [InlineData("restart", 0.25)]
    [InlineData("restart", 0.75)]
    public void Decode_LibjpegFileCutInScanWithEndMarkerAppended_RefusedAsTruncated(string kind, double keep)
    {
        byte[] whole = Libjpeg(kind);

        string path = Cut(whole, keep, kind);
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));

        Assert.Equal(ImageDecodeFailure.Corrupt, ex.Failure);
        Assert.Contains("truncated", ex.Message, StringComparison.Ordinal);
        Assert.Contains("MCUs", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.2)]
    [InlineData(0.6)]
    [InlineData(0.999)]
    public void Decode_ImageSharpFileCutInScanWithEndMarkerAppended_RefusedAsTruncated(double keep)
    {
        byte[] whole = ImageSharpJpeg();

        string path = Cut(whole, keep, "imagesharp");
        var ex = Assert.Throws<ImageDecodeException>(() => GrayImageDecoder.Decode(path));

        Assert.Contains("truncated", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("gray")]
    [InlineData("colour")]
    [InlineData("restart")]
    [InlineData("progressive")]
    public void Decode_WholeLibjpegFile_Decodes(string kind)
    {
        string path = _folder.File(kind + ".jpg");
        File.WriteAllBytes(path, Libjpeg(kind));

        GrayImage image = GrayImageDecoder.Decode(path);

        Assert.Equal((640, 480), (image.Width, image.Height));
    }

    [Fact]
    public void Decode_WholeImageSharpFile_Decodes()
    {
        string path = _folder.File("imagesharp.jpg");
        File.WriteAllBytes(path, ImageSharpJpeg());

        GrayImage image = GrayImageDecoder.Decode(path);

        Assert.Equal((300, 200), (image.Width, image.Height));
    }

    /// <summary>Keeps the headers and <paramref name="keep"/> of the first scan's entropy-coded data, then appends FF D9.</summary>
    private string Cut(byte[] whole, double keep, string name)
    {
        int scan = ScanDataStart(whole);
        int end = whole.Length - 2; // the file's own EOI
        int cut = scan + (int)((end - scan) * keep);
        if (whole[cut - 1] == 0xFF)
        {
            cut--; // never leave a lone FF before the appended marker
        }
        string path = _folder.File(name + "-cut-" + keep.ToString(System.Globalization.CultureInfo.InvariantCulture) + ".jpg");
        File.WriteAllBytes(path, [.. whole.AsSpan(0, cut), 0xFF, 0xD9]);
        return path;
    }

    private static int ScanDataStart(byte[] data)
    {
        for (int i = 2; i + 3 < data.Length; i++)
        {
            if (data[i] == 0xFF && data[i + 1] == 0xDA)
            {
                return i + 2 + ((data[i + 2] << 8) | data[i + 3]);
            }
        }
        throw new InvalidOperationException("no scan in the JPEG");
    }

    private byte[] Libjpeg(string kind)
    {
        string path = _folder.File("ref-" + kind + ".jpg");
        ReferencePython.Run("imaging_write_jpeg.py", path, kind);
        return File.ReadAllBytes(path);
    }

    private static byte[] ImageSharpJpeg()
    {
        var random = new Random(17);
        using var image = new Image<L8>(300, 200);
        for (int y = 0; y < 200; y++)
        {
            for (int x = 0; x < 300; x++)
            {
                image[x, y] = new L8((byte)(60 + random.Next(0, 40) + (((x / 30) + (y / 30)) % 2 * 100)));
            }
        }
        using var stream = new MemoryStream();
        image.SaveAsJpeg(stream, new JpegEncoder { Quality = 85 });
        return stream.ToArray();
    }
}
