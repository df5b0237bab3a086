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
        output.WriteLine($"radius mean {analysis.Statistics.Radius?.Mean:0.0} nm; split {analysis.Wires.Count(w => w.Split)}, of which elongated {analysis.Wires.Count(w => w.Split && w.Class == WireClass.Elongated)}, vertical {analysis.Wires.Count(w => w.Split && w.Class == WireClass.Vertical)}; drawn tilted {field.Objects.Count(o => o.Kind == SemObjectKind.Tilted)}");
        Assert.Equal(field.InfoStripRows, analysis.ExcludedBottomRows);
        Assert.InRange(analysis.Statistics.ObjectsFound, field.Objects.Count * 0.97, field.Objects.Count * 1.03);
    }

    [Fact]
    public void Generate_SameSeed_GivesSamePixels()
    {
        Assert.Equal(Fields.Standard(3, 256, 192, 60, strip: 16).Pixels, Fields.Standard(3, 256, 192, 60, strip: 16).Pixels);
        Assert.NotEqual(Fields.Standard(3, 256, 192, 60, strip: 16).Pixels, Fields.Standard(4, 256, 192, 60, strip: 16).Pixels);
    }

    [Fact]
    public void Analyze_GeneratedField_ReportsPointPatternsAndZones()
    {
        SemField field = Fields.Standard(9);
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        FieldAnalysis analysis = FieldAnalyzer.AnalyzeWithRaster(image, "generated", new FieldSidecar { PixelSizeNm = 5 },
            new FieldAnalysisOptions { DiffusionLengthNm = 80 }).Analysis;
        FieldStatistics s = analysis.Statistics;
        output.WriteLine($"R {s.ClarkEvansR:0.000} z {s.ClarkEvansZ:0.0}; beta {s.WignerBeta:0.00} i {s.CriticalNucleus:0.0}; edge Â {s.EdgeZoneNormalized?.Mean:0.000}, centroid Â {s.CentroidZoneNormalized?.Mean:0.000}");
        // The sites are a hard-core scatter: more ordered than Poisson, so R > 1 (Clark & Evans 1954).
        Assert.True(s.ClarkEvansR > 1.1, $"R = {s.ClarkEvansR}");
        Assert.NotNull(s.WignerBeta);
        // DERIVED: edge zones and wire footprints are disjoint parts of the analysed area; so are centroid zones.
        double analysed = s.AnalysedAreaPixels * 25;
        Assert.InRange(analysis.Wires.Sum(w => w.EdgeZoneArea!.Value + (w.AreaPixels * 25)), 0.5 * analysed, analysed);
        Assert.InRange(analysis.Wires.Sum(w => w.CentroidZoneArea!.Value), 0.5 * analysed, analysed);
        Assert.All(analysis.Wires.Where(w => w.ZoneGuarded == false), w => Assert.InRange(w.CentroidZoneNormalized!.Value, 0, 1));
        // Density: every object counted by centroid over the analysed area, 5 nm pixels (DERIVED: 1 µm² = 1e-8 cm²).
        double areaUm2 = field.Width * (field.Height - field.InfoStripRows) * 25e-6;
        Assert.Equal(analysis.Wires.Count / areaUm2, s.DensityPerUm2!.Value, 9);
        Assert.Equal(s.DensityPerUm2.Value * 1e8, s.DensityPerCm2!.Value, 3);
    }

    [Fact]
    public void Analyze_GeneratedField_FindsEachDrawnVerticalWireAtItsSite()
    {
        // Ground truth from the generator: every vertical wire clear of the border and of any other object
        // must be found within 1 px of its site, and classified vertical.
        SemField field = Fields.Standard(15);
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        FieldAnalysis analysis = FieldAnalyzer.AnalyzeWithRaster(image, "truth", null, new FieldAnalysisOptions()).Analysis;
        int validH = field.Height - field.InfoStripRows;
        var isolated = field.Objects.Where(o => o.Kind == SemObjectKind.Vertical
            && o.X > 2 * o.Size && o.Y > 2 * o.Size && o.X < field.Width - 2 * o.Size && o.Y < validH - 2 * o.Size
            && field.Objects.All(p => p == o || Math.Sqrt((p.X - o.X) * (p.X - o.X) + (p.Y - o.Y) * (p.Y - o.Y)) > o.Size + p.Size + p.Length / 2 + 3)).ToList();
        int found = 0, vertical = 0;
        double ratioSum = 0;
        foreach (SemObject o in isolated)
        {
            var match = analysis.Wires.FirstOrDefault(w => Math.Abs(w.CentroidX - o.X) < 1 && Math.Abs(w.CentroidY - o.Y) < 1);
            if (match is not null)
            {
                found++;
                ratioSum += match.EquivalentRadius / Math.Sqrt(o.HexagonArea / Math.PI);
                vertical += match.Class == WireClass.Vertical ? 1 : 0;
            }
        }
        output.WriteLine($"{isolated.Count} isolated vertical wires: {found} found, {vertical} classified vertical; measured/drawn equivalent radius {ratioSum / found:0.000}");
        Assert.True(isolated.Count > 300);
        Assert.Equal(isolated.Count, found);
        Assert.True(vertical >= 0.98 * isolated.Count, $"{vertical} of {isolated.Count} classified vertical");
        // COMPUTED HERE: the radius comes out about 3 % small (0.972 with this seed): Otsu puts the threshold above
        // the edge midpoint because the bright droplets raise the wire class's mean, and smoothing widens the
        // edge. The check bounds that bias at 5 %; docs/imaging.md reports it.
        Assert.InRange(ratioSum / found, 0.95, 1.02);
    }
}
