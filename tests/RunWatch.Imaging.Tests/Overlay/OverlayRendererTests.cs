using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Overlay;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Tests.Support;
using Xunit;

namespace RunWatch.Imaging.Tests.Overlay;

public sealed class OverlayRendererTests
{
    [Fact]
    public void Render_TwoHexagons_OutlinesInClassColourAndScaleBarOfNiceLength()
    {
        // 400 px at 5 nm: a fifth of the width is 400 nm, rounded down to the 1-2-5 series: 200 nm = 40 px.
        GrayImage image = Shapes.Draw(400, 300, (x, y) => Shapes.InHexagon(x, y, 150.3, 120.7, 12, 10) || Shapes.InHexagon(x, y, 260.5, 150.2, 12, 40));
        (FieldAnalysis analysis, FieldRaster raster) = FieldAnalyzer.AnalyzeWithRaster(image, "pair", new FieldSidecar { PixelSizeNm = 5 },
            new FieldAnalysisOptions { BackgroundWindowPixels = 0, DenoiseRadius = 0, DetectInfoStrip = false });
        Assert.Equal(2, analysis.Statistics.Vertical);
        byte[] rgb = OverlayRenderer.Render(analysis, raster);
        (byte r, byte g, byte b) = OverlayRenderer.ClassColours[WireClass.Vertical];
        int outline = 0;
        for (int i = 0; i < raster.Labels.Length; i++)
        {
            if (raster.Labels[i] != 0 && rgb[3 * i] == r && rgb[3 * i + 1] == g && rgb[3 * i + 2] == b)
            {
                outline++;
            }
        }
        // Two hexagons of side 12: each boundary is roughly its crack length 4/π · 6a ≈ 92 px (DERIVED, ±30 %).
        Assert.InRange(outline, 2 * 60, 2 * 120);

        int longestWhiteRun = 0;
        for (int y = 200; y < 300; y++)
        {
            int run = 0;
            for (int x = 0; x < 400; x++)
            {
                int i = 3 * (y * 400 + x);
                run = rgb[i] == 255 && rgb[i + 1] == 255 && rgb[i + 2] == 255 ? run + 1 : 0;
                longestWhiteRun = Math.Max(longestWhiteRun, run);
            }
        }
        Assert.Equal(40, longestWhiteRun);
    }

    [Fact]
    public void Ink_Digits_AreDistinct()
    {
        var shapes = new HashSet<string>();
        foreach (char c in "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZ")
        {
            var bits = new System.Text.StringBuilder();
            for (int row = 0; row < BitmapFont.GlyphHeight; row++)
            {
                for (int col = 0; col < BitmapFont.GlyphWidth; col++)
                {
                    bits.Append(BitmapFont.Ink(c, col, row) ? '#' : '.');
                }
            }
            Assert.True(shapes.Add(bits.ToString()), $"glyph '{c}' repeats another");
        }
    }
}
