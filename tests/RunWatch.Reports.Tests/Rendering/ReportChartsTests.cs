using System.Xml;
using RunWatch.Reports.Rendering;
using RunWatch.Reports.Tests.Support;
using SkiaSharp;
using Xunit;

namespace RunWatch.Reports.Tests.Rendering;

public sealed class ReportChartsTests
{
    [Fact]
    public void Render_SampleReport_SvgsParseAndCarryAxisLabelsAsText()
    {
        ReportChartSet charts = ReportChartSet.Render(SampleReport.Build());
        (ReportChart Chart, string Label)[] expected =
        [
            (charts.Thermal, "substrate temperature"),
            (charts.Histogram, "radius (nm)"),
            (charts.RadiusVersusArea, "normalised capture area"),
            (charts.PredictedVersusMeasured!, "predicted radius (nm)"),
        ];
        foreach ((ReportChart chart, string label) in expected)
        {
            var doc = new XmlDocument { XmlResolver = null };
            doc.LoadXml(chart.Svg);
            Assert.Equal("svg", doc.DocumentElement!.LocalName);
            XmlNodeList texts = doc.GetElementsByTagName("text");
            Assert.True(texts.Count > 5, $"{chart.Title}: only {texts.Count} text elements");
            Assert.Contains(texts.Cast<XmlElement>(), t => t.InnerText.Contains(label, StringComparison.Ordinal));
        }
    }

    [Fact]
    public void Render_SampleReport_PngsHaveInkBeyondTheBackground()
    {
        ReportChartSet charts = ReportChartSet.Render(SampleReport.Build());
        foreach (ReportChart chart in new[] { charts.Thermal, charts.Histogram, charts.RadiusVersusArea, charts.PredictedVersusMeasured! })
        {
            using SKBitmap bitmap = SKBitmap.Decode(chart.Png);
            Assert.Equal(chart.WidthPx * 2, bitmap.Width);
            int dark = 0;
            for (int y = 0; y < bitmap.Height; y += 2)
            {
                for (int x = 0; x < bitmap.Width; x += 2)
                {
                    SKColor c = bitmap.GetPixel(x, y);
                    dark += c.Red + c.Green + c.Blue < 300 ? 1 : 0;
                }
            }
            double share = dark / (bitmap.Width * bitmap.Height / 4.0);
            Assert.InRange(share, 0.002, 0.5);
        }
    }

    [Fact]
    public void Render_TitleText_PutsGlyphPixelsInTheTitleBand()
    {
        // The blank-text failure (ScottPlot#3504, no fontconfig in SkiaSharp's NoDependencies build) leaves the
        // title band empty: compare the same plot with and without a title.
        ReportFonts.EnsureLoaded();
        byte[] Render(string title)
        {
            using var plot = new ScottPlot.Plot();
            plot.Font.Set(ReportFonts.Sans);
            plot.Add.Scatter(new double[] { 0, 1, 2 }, new double[] { 1, 0, 1 });
            plot.Title(title);
            return plot.GetImageBytes(400, 300, ScottPlot.ImageFormat.Png);
        }
        using SKBitmap withTitle = SKBitmap.Decode(Render("Radius WWWW"));
        using SKBitmap blankTitle = SKBitmap.Decode(Render(" "));
        int differing = 0;
        for (int y = 0; y < 30; y++)
        {
            for (int x = 0; x < 400; x++)
            {
                differing += withTitle.GetPixel(x, y) != blankTitle.GetPixel(x, y) ? 1 : 0;
            }
        }
        Assert.True(differing > 100, $"only {differing} pixels differ in the title band");
    }

    [Fact]
    public void Folder_FindsDejaVuFonts()
    {
        Assert.True(File.Exists(Path.Combine(ReportFonts.Folder, "DejaVuSans.ttf")));
        Assert.Equal("DejaVu Sans", ReportFonts.Regular.FamilyName);
    }
}
