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
        (Analysis, FieldRaster raster) = FieldAnalyzer.AnalyzeWithRaster(image, "truth", sidecar, options ?? new FieldAnalysisOptions());
        CosTilt = Math.Abs(field.Spec.TiltDeg) > 1 ? Math.Cos(field.Spec.TiltDeg * Math.PI / 180) : 1;
        var byId = Analysis.Wires.ToDictionary(w => w.Id);
        foreach (MicroscopeObject o in field.Objects)
        {
            // The found object is the one whose label covers the drawn centre (for a crystallite: its outline's area centroid).
            (double cx, double cy) = Centre(o);
            int x = (int)Math.Floor(cx), y = (int)Math.Floor(cy);
            int id = x >= 0 && y >= 0 && x < field.Width && y < field.Height ? raster.Labels[(y * field.Width) + x] : 0;
            Pairs.Add((o, id > 0 && byId.TryGetValue(id, out WireMeasurement? w) ? w : null));
        }
    }

    private (double X, double Y) Centre(MicroscopeObject o)
    {
        if (o.Kind != SemObjectKind.Parasitic || o.Outline.Count < 3)
        {
            return (o.X, o.Y);
        }
        double a = 0, sx = 0, sy = 0;
        for (int i = 0; i < o.Outline.Count; i++)
        {
            var p = o.Outline[i];
            var q = o.Outline[(i + 1) % o.Outline.Count];
            double c = (p.X * q.Y) - (q.X * p.Y);
            a += c;
            sx += (p.X + q.X) * c;
            sy += (p.Y + q.Y) * c;
        }
        return (o.X + (sx / (3 * a)), o.Y + (sy / (3 * a) * CosTilt));
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
