using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Scale;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Analysis;

public sealed class FieldAnalyzerTests(ITestOutputHelper output)
{
    [Fact]
    public void Analyze_GeneratedField_FindsTheDrawnWires()
    {
        SemField field = Fields.Standard();
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        (FieldAnalysis analysis, _) = FieldAnalyzer.AnalyzeWithRaster(image, "generated", new FieldSidecar { PixelSizeNm = 5 },
            new FieldAnalysisOptions { DiffusionLengthNm = 100 });
        int drawnVertical = field.Objects.Count(o => o.Kind == SemObjectKind.Vertical);
        output.WriteLine($"drawn {field.Objects.Count} ({drawnVertical} vertical); found {analysis.Statistics.ObjectsFound}, interior {analysis.Statistics.InteriorObjects}, vertical {analysis.Statistics.Vertical}, elongated {analysis.Statistics.Elongated}, oversized {analysis.Statistics.Oversized}, irregular {analysis.Statistics.Irregular}; threshold {analysis.Threshold}; band {analysis.ExcludedBottomRows} {analysis.ExcludedBandSource}");
        output.WriteLine(string.Join("; ", analysis.Timings.Select(t => $"{t.Stage} {t.Milliseconds:0.0}")));
        output.WriteLine($"radius mean {analysis.Statistics.Radius?.Mean:0.0} nm; split {analysis.Wires.Count(w => w.Split)}");
        Assert.Equal(field.InfoStripRows, analysis.ExcludedBottomRows);
        Assert.InRange(analysis.Statistics.ObjectsFound, field.Objects.Count * 0.97, field.Objects.Count * 1.03);
    }
}
