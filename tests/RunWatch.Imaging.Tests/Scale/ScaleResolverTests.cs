using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Scale;

public sealed class ScaleResolverTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static readonly EmbeddedResolution TiffAt40Nm = new(250_000, 250_000, 3);

    [Fact]
    public void Resolve_AllThreeSources_SidecarWins()
    {
        FieldScale scale = ScaleResolver.Resolve(new FieldSidecar { PixelSizeNm = 2.5 }, 7, TiffAt40Nm);
        Assert.Equal((2.5, ScaleSource.Sidecar), (scale.PixelSizeNm!.Value, scale.Source));
    }

    [Fact]
    public void Resolve_GivenAndTiff_GivenWins()
    {
        FieldScale scale = ScaleResolver.Resolve(new FieldSidecar { WaferId = "W-1" }, 7, TiffAt40Nm);
        Assert.Equal((7.0, ScaleSource.Given), (scale.PixelSizeNm!.Value, scale.Source));
    }

    [Fact]
    public void Resolve_TiffOnly_UsesTags()
    {
        // DERIVED: 250,000 pixels per cm = 1e7 nm / 250,000 = 40 nm per pixel.
        FieldScale scale = ScaleResolver.Resolve(null, null, TiffAt40Nm);
        Assert.Equal(40, scale.PixelSizeNm!.Value, 9);
        Assert.Equal("nm", scale.LengthUnit);
    }

    [Fact]
    public void Resolve_Nothing_SaysPixels()
    {
        FieldScale scale = ScaleResolver.Resolve(null, null, null);
        Assert.False(scale.HasScale);
        Assert.Equal("px", scale.LengthUnit);
        Assert.Contains("lengths are in pixels", scale.Note);
    }

    [Fact]
    public void Sidecar_RoundTrip_KeepsEveryMember()
    {
        string image = _folder.File("f01.tif");
        var written = new FieldSidecar { PixelSizeNm = 2.5, WaferId = "W-0412-A", FieldPosition = new FieldPosition(12.5, -3), TiltDeg = 0, ExcludedBottomRows = 64 };
        written.WriteFor(image);
        Assert.True(File.Exists(_folder.File("f01.tif.field.json")));
        Assert.Equal(written, FieldSidecar.TryLoadFor(image));
    }

    [Theory]
    [InlineData("{\"format\":\"runwatch-field/1\",\"pixelSizeNm\":-1}", "pixelSizeNm")]
    [InlineData("{\"format\":\"other/2\"}", "format")]
    [InlineData("{\"format\":\"runwatch-field/1\",\"tiltDeg\":95}", "tiltDeg")]
    [InlineData("not json", "not valid JSON")]
    public void Sidecar_Invalid_ThrowsNamingFileAndField(string json, string expected)
    {
        string image = _folder.File("f02.png");
        File.WriteAllText(FieldSidecar.PathFor(image), json);
        var ex = Assert.Throws<FieldSidecarException>(() => FieldSidecar.TryLoadFor(image));
        Assert.Contains("f02.png.field.json", ex.Message);
        Assert.Contains(expected, ex.Message);
    }

    [Fact]
    public void Sidecar_Absent_IsNull() => Assert.Null(FieldSidecar.TryLoadFor(_folder.File("none.png")));
}
