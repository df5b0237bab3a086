using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Analysis;

/// <summary>
/// Radius at the sub-pixel edge against the generator's truth: exact hexagon areas (3√3/2)a² (DERIVED), drawn with
/// rims, beam blur, shot noise, jitter, drift, texture and tilt by RunWatch.Simulation.Sem.MicroscopeFieldGenerator,
/// which knows nothing of the analyser. Bias and recall are printed per effect.
/// </summary>
public sealed class EdgeRadiusTruthTests(ITestOutputHelper output)
{
    private static MicroscopeFieldSpec Effects(int seed, double rim = 0.8, double dose = 40, double drift = 0.1, double jitter = 0.15, double tilt = 0, double beam = 0.8) => new()
    {
        Width = 1024, Height = 768, Seed = seed, RimYield = rim, DoseElectronsPerPixel = dose, DriftFraction = drift, ScanJitterPx = jitter,
        TiltDeg = tilt, BeamSigmaPx = beam,
    };

    /// <summary>Effect, rim, dose, drift, jitter, tilt, allowed median |error|, least recall. The goal is 2 % and 98 %;
    /// the two cases allowed more are the measured limits (docs/imaging.md): at 12 electrons per pixel noise biases the
    /// crossings outwards and roughens small outlines (some cut or called irregular), and a 30 % gain drift puts the dimmest tops under the global Otsu threshold.</summary>
    public static TheoryData<string, double, double, double, double, double, double, double> Cases() => new()
    {
        { "default (rims, dose 40, drift 10 %, jitter 0.15 px)", 0.8, 40, 0.1, 0.15, 0, 0.02, 0.98 },
        { "rims off", 0, 40, 0.1, 0.15, 0, 0.02, 0.98 },
        { "strong rims", 1.6, 40, 0.1, 0.15, 0, 0.02, 0.98 },
        { "dose 12", 0.8, 12, 0.1, 0.15, 0, 0.035, 0.95 },
        { "dose 200", 0.8, 200, 0.1, 0.15, 0, 0.02, 0.98 },
        { "drift 30 %", 0.8, 40, 0.3, 0.15, 0, 0.02, 0.85 },
        { "jitter 0.4 px", 0.8, 40, 0.1, 0.4, 0, 0.02, 0.98 },
        { "tilt 30°", 0.8, 40, 0.1, 0.15, 30, 0.02, 0.98 },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void EdgeRadius_GeneratedEffects_MedianErrorWithinTwoPercentAndNoTrend(string effect, double rim, double dose, double drift, double jitter, double tilt, double tolerance, double minRecall)
    {
        var errors = new List<(double Radius, double Relative)>();
        int plain = 0, vertical = 0;
        var thresholdErrors = new List<double>();
        // One field per radius band (a wafer's wires are alike; a field spanning 4–20 px would call its largest oversized).
        foreach (var (seed, min, max, units) in new[] { (31, 4.0, 8.0, 320), (32, 8.0, 13.0, 200), (33, 13.0, 20.0, 110) })
        {
            MicroscopeFieldSpec spec = Effects(seed, rim, dose, drift, jitter, tilt);
            var scene = new MicroscopeSceneOptions { Seed = seed, MinRadiusPx = min, MaxRadiusPx = max, Units = units };
            var m = new TruthMatch(MicroscopeFieldGenerator.Generate(MicroscopeFields.With(spec, MicroscopeScene.Build(spec, scene))));
            foreach (var (t, f) in m.PlainIsolated())
            {
                plain++;
                if (f is null || f.Class != WireClass.Vertical)
                {
                    continue;
                }
                vertical++;
                errors.Add((t.EquivalentRadius, (f.EquivalentRadius / t.EquivalentRadius) - 1));
                thresholdErrors.Add((f.ThresholdRadius / t.EquivalentRadius) - 1);
            }
        }
        double Median(IEnumerable<double> v)
        {
            double[] s = v.OrderBy(x => x).ToArray();
            return s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[(s.Length / 2) - 1] + s[s.Length / 2]);
        }
        double all = Median(errors.Select(e => e.Relative));
        double absolute = Median(errors.Select(e => Math.Abs(e.Relative)));
        double small = Median(errors.Where(e => e.Radius < 8).Select(e => e.Relative));
        double middle = Median(errors.Where(e => e.Radius is >= 8 and < 13).Select(e => e.Relative));
        double large = Median(errors.Where(e => e.Radius >= 13).Select(e => e.Relative));
        output.WriteLine($"{effect}: recall (found and vertical) {vertical}/{plain} = {(double)vertical / plain:P1}; edge radius median error {all:+0.00%;-0.00%}, median |error| {absolute:0.00%}; " +
            $"by radius 4–8 px {small:+0.00%;-0.00%}, 8–13 px {middle:+0.00%;-0.00%}, 13–20 px {large:+0.00%;-0.00%}; threshold radius median error {Median(thresholdErrors):+0.00%;-0.00%}");
        Assert.True(plain > 100, $"only {plain} plain wires drawn");
        Assert.True(vertical >= minRecall * plain, $"{vertical} of {plain} found as vertical wires");
        Assert.InRange(absolute, 0, tolerance);
        // No trend with radius: the small and large wires' median errors differ by less than 2 % of the radius.
        Assert.InRange(small - large, -0.02, 0.02);
    }
}
