using RunWatch.Imaging.Segmentation;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;

namespace RunWatch.Imaging.Tests.Segmentation;

public sealed class InfoStripDetectorTests
{
    [Theory]
    [InlineData(48)]
    [InlineData(20)]
    public void Detect_GeneratedStrip_FindsItsHeight(int rows)
    {
        SemField field = Fields.Standard(12, 512, 384, 150, strip: rows);
        Assert.Equal(rows, InfoStripDetector.DetectBottomRows(field.Pixels, field.Width, field.Height));
    }

    [Fact]
    public void Detect_NoStrip_FindsNothing()
    {
        SemField field = Fields.Standard(13, 512, 384, 150, strip: 0);
        Assert.Equal(0, InfoStripDetector.DetectBottomRows(field.Pixels, field.Width, field.Height));
    }

    [Fact]
    public void Detect_UniformImage_IsNotAStrip()
    {
        var pixels = new ushort[100 * 80];
        Assert.Equal(0, InfoStripDetector.DetectBottomRows(pixels, 100, 80));
    }
}
