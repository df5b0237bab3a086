using RunWatch.Imaging.Scale;
using Xunit;

namespace RunWatch.Imaging.Tests.Scale;

/// <summary>A sidecar given as text (an upload) is held to the same bounds as one found in the drop folder.</summary>
public sealed class FieldSidecarParseTests
{
    [Fact]
    public void Parse_ValidText_ReadsEveryMember()
    {
        var sidecar = FieldSidecar.Parse("""{"format":"runwatch-field/1","pixelSizeNm":2.5,"waferId":"W-0412-A","fieldPosition":{"xMm":12.5,"yMm":-3}}""", "upload");
        Assert.Equal((2.5, "W-0412-A", 12.5, -3.0), (sidecar.PixelSizeNm, sidecar.WaferId, sidecar.FieldPosition!.XMm, sidecar.FieldPosition.YMm));
    }

    [Theory]
    [InlineData("""{"format":"other/1"}""", "format is 'other/1'")]
    [InlineData("""{"format":"runwatch-field/1","pixelSizeNm":-1}""", "pixelSizeNm")]
    [InlineData("""{"format":"runwatch-field/1","tiltDeg":95}""", "tiltDeg")]
    [InlineData("""not json""", "not valid JSON")]
    public void Parse_BadText_RefusedWithTheReason(string text, string reason)
    {
        var ex = Assert.Throws<FieldSidecarException>(() => FieldSidecar.Parse(text, "upload"));
        Assert.Contains(reason, ex.Message, StringComparison.Ordinal);
    }
}
