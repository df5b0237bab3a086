using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Scale;
using RunWatch.Simulation.Sem;

namespace RunWatch.Imaging.Tests.Support;

/// <summary>Analyses a microscope-like field (no scale: lengths in px) and pairs each drawn object with the found object nearest its centre.</summary>
internal sealed class TruthMatch
{
    public TruthMatch(MicroscopeField field, FieldAnalysisOptions? options = null)
    {
        Field = field;
        var image = new GrayImage(field.Width, field.Height, field.Pixels);
        var sidecar = new FieldSidecar { TiltDeg = field.Spec.TiltDeg };
        Analysis = FieldAnalyzer.AnalyzeWithRaster(image, "truth", sidecar, options ?? new FieldAnalysisOptions()).Analysis;
        CosTilt = Math.Abs(field.Spec.TiltDeg) > 1 ? Math.Cos(field.Spec.TiltDeg * Math.PI / 180) : 1;
        foreach (MicroscopeObject o in field.Objects)
        {
            double reach = Math.Max(1.5, 0.5 * Math.Min(o.Size, o.EquivalentRadius));
            WireMeasurement? best = null;
            double bestD = reach;
            foreach (WireMeasurement w in Analysis.Wires)
            {
                double d = Math.Sqrt(Math.Pow(w.CentroidX - o.X, 2) + Math.Pow(w.CentroidY - (o.Y / CosTilt), 2));
                if (d < bestD)
                {
                    bestD = d;
                    best = w;
                }
            }
            Pairs.Add((o, best));
        }
    }

    public MicroscopeField Field { get; }

    public FieldAnalysis Analysis { get; }

    public double CosTilt { get; }

    public List<(MicroscopeObject Truth, WireMeasurement? Found)> Pairs { get; } = [];

    /// <summary>Vertical wires without droplet, not touching anything, clear of the image edge and the strip.</summary>
    public IEnumerable<(MicroscopeObject Truth, WireMeasurement? Found)> PlainIsolated() => Pairs.Where(p =>
        p.Truth.Kind == SemObjectKind.Vertical && p.Truth.DropletRadius == 0 && p.Truth.Group == 0 && Interior(p.Truth));

    public bool Interior(MicroscopeObject o)
    {
        double m = o.Size + 6;
        return o.X > m && o.X < Field.Width - m && o.Y > Field.Spec.SampleTop + m && o.Y < Field.Spec.SampleTop + Field.Spec.SampleRows - m;
    }
}
