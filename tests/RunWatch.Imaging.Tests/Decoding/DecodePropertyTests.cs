using CsCheck;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Testing.Fuzzing;
using Xunit;

namespace RunWatch.Imaging.Tests.Decoding;

/// <summary>
/// Property-based fuzzing with CsCheck of the decode path and the sidecar reader. Seeds: small valid PNG (16 bit),
/// BMP, JPEG and TIFF files made at test time (the TIFF by Pillow, an independent writer) and the committed sidecar
/// corpus (Scale/Corpus), mutated by byte flips, insertions and cuts. Decoding any input either gives an image within
/// its limits or fails with <see cref="ImageDecodeException"/>; reading any sidecar gives one whose values lie within
/// <see cref="FieldValueBounds"/> or fails with <see cref="FieldSidecarException"/>. Time per target:
/// <see cref="Fuzz.Seconds"/>.
/// </summary>
public sealed class DecodePropertyTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Decode_MutatedImages_ImageOrImageDecodeExceptionOnly()
    {
        byte[][] seeds = [Seed("s.png"), Seed("s.bmp"), Seed("s.jpg"), TiffSeed()];
        var limits = new ImageLimits { MaxPixels = 4_000_000 };
        Gen.Select(Gen.Int[0, seeds.Length - 1], Fuzz.Mutations).Sample(input =>
        {
            byte[] bytes = Fuzz.Apply(seeds[input.Item1], input.Item2);
            using var stream = new MemoryStream(bytes, writable: false);
            try
            {
                GrayImage image = GrayImageDecoder.Decode(stream, "fuzz", limits);
                Assert.InRange((long)image.Width * image.Height, 1, limits.MaxPixels);
                Assert.Equal(image.Width * image.Height, image.Pixels.Length);
            }
            catch (ImageDecodeException)
            {
                // Refused with a reason: what a damaged file must get.
            }
        }, time: Fuzz.Seconds, threads: 1);
    }

    [Fact]
    public void TryLoadFor_MutatedSidecars_BoundedSidecarOrSidecarExceptionOnly()
    {
        string[] corpus = [.. Directory.GetFiles(Path.Combine(AppContext.BaseDirectory, "Scale", "Corpus")).Order(StringComparer.Ordinal)];
        Assert.NotEmpty(corpus);
        byte[][] seeds = [.. corpus.Select(File.ReadAllBytes)];
        string image = _folder.File("f.png");
        Gen.Select(Gen.Int[0, seeds.Length - 1], Fuzz.Mutations).Sample(input =>
        {
            File.WriteAllBytes(FieldSidecar.PathFor(image), Fuzz.Apply(seeds[input.Item1], input.Item2));
            try
            {
                FieldSidecar? sidecar = FieldSidecar.TryLoadFor(image);
                Assert.NotNull(sidecar);
                if (sidecar.PixelSizeNm is { } p)
                {
                    Assert.InRange(p, FieldValueBounds.MinPixelSizeNm, FieldValueBounds.MaxPixelSizeNm);
                }
                if (sidecar.FieldPosition is { } at)
                {
                    Assert.InRange(Math.Abs(at.XMm), 0, FieldValueBounds.MaxPositionMm);
                    Assert.InRange(Math.Abs(at.YMm), 0, FieldValueBounds.MaxPositionMm);
                }
            }
            catch (FieldSidecarException)
            {
                // Refused naming the file: what a bad sidecar must get.
            }
        }, time: Fuzz.Seconds, threads: 1);
    }

    private byte[] Seed(string name)
    {
        string path = _folder.File(name);
        if (name.EndsWith(".png", StringComparison.Ordinal))
        {
            var pixels = new ushort[48 * 32];
            for (int i = 0; i < pixels.Length; i++)
            {
                pixels[i] = (ushort)(i * 37);
            }
            TestImages.WritePng16(path, pixels, 48, 32);
        }
        else
        {
            using var image = new SixLabors.ImageSharp.Image<SixLabors.ImageSharp.PixelFormats.L8>(40, 30, new SixLabors.ImageSharp.PixelFormats.L8(120));
            SixLabors.ImageSharp.ImageExtensions.Save(image, path);
        }
        return File.ReadAllBytes(path);
    }

    private byte[] TiffSeed()
    {
        string path = _folder.File("s.tif");
        ReferenceTiff.Write(path, "I;16", 0, 0, 0);
        return File.ReadAllBytes(path);
    }
}
