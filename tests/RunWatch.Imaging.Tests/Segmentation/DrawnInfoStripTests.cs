using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Segmentation;

/// <summary>Information strips drawn with text, a logo and a scale bar (the generator's truth: rows and bar length).</summary>
public sealed class DrawnInfoStripTests(ITestOutputHelper output)
{
    private static MicroscopeField Field(int seed, bool top, int rows, double barNm, double pixelNm = 10) =>
        MicroscopeFields.Make(seed, s => new MicroscopeFieldSpec { Width = 900, Height = 700, Seed = seed, StripRows = rows, StripAtTop = top, ScaleBarNm = barNm, PixelSizeNm = pixelNm },
            new MicroscopeSceneOptions { Seed = seed, Units = 200 }, 900, 700, stripAtTop: top);

    [Theory]
    [InlineData(71, false, 56, 2000)]
    [InlineData(72, true, 56, 1000)]
    [InlineData(73, true, 40, 500)]
    [InlineData(74, false, 90, 2000)]
    public void Analyze_DrawnStrip_IsFoundAtItsEndWithTheBarLength(int seed, bool top, int rows, double barNm)
    {
        MicroscopeField field = Field(seed, top, rows, barNm);
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        FieldAnalysis a = FieldAnalyzer.AnalyzeWithRaster(image, "strip", new FieldSidecar { PixelSizeNm = 10 }).Analysis;
        output.WriteLine($"strip {(top ? "top" : "bottom")} {rows} rows: found top {a.ExcludedTopRows}, bottom {a.ExcludedBottomRows}; bar drawn {field.ScaleBarPixels} px, measured {a.ScaleBarPixels} px; {a.Notes.FirstOrDefault(n => n.Contains("scale bar"))}");
        Assert.Equal(top ? rows : 0, a.ExcludedTopRows);
        Assert.Equal(top ? 0 : rows, a.ExcludedBottomRows);
        Assert.Equal(field.ScaleBarPixels, a.ScaleBarPixels);
        Assert.Contains(a.Notes, n => n.Contains("consistent with the configured scale"));
        // Nothing is reported inside the strip.
        double stripFrom = top ? 0 : (field.Height - rows) * 10, stripTo = top ? rows * 10 : field.Height * 10;
        Assert.DoesNotContain(a.Wires, w => w.CentroidY > stripFrom && w.CentroidY < stripTo);
        Assert.True(a.Wires.Count > 150);
    }

    [Fact]
    public void Analyze_WrongPixelSize_ScaleBarNoteWarns()
    {
        // Drawn at 10 nm/px with a 1 µm bar (100 px); configured as 13 nm/px the bar spans 1300 nm, not a round length.
        MicroscopeField field = Field(75, false, 56, 1000);
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        FieldAnalysis a = FieldAnalyzer.AnalyzeWithRaster(image, "strip", new FieldSidecar { PixelSizeNm = 13 }).Analysis;
        Assert.Equal(100, a.ScaleBarPixels);
        Assert.Equal(1300, a.ScaleBarLength!.Value, 6);
        Assert.Contains(a.Notes, n => n.Contains("check the pixel size"));
    }

    [Theory]
    [InlineData(1000, 1000)]
    [InlineData(1930, 2000)]
    [InlineData(4400, 5000)]
    [InlineData(140, 100)]
    [InlineData(7600, 10000)]
    public void NearestRound_Lengths_AreOneTwoFiveDecades(double length, double expected)
    {
        Assert.Equal(expected, ScaleBarCheck.NearestRound(length), 9);
    }
}
