using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Analysis;

/// <summary>
/// Radius at the sub-pixel edge against the generator's truth: exact hexagon areas (3√3/2)a², drawn with rims, beam blur,
/// shot noise, jitter, drift and texture (RunWatch.Simulation.Sem.MicroscopeFieldGenerator), independent of the analyser.
/// </summary>
public sealed class EdgeRadiusTruthTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(0.8, 40, 0.8)]
    [InlineData(0.0, 40, 0.8)]
    [InlineData(0.8, 0, 0.0)]
    public void Diagnose(double rim, double dose, double beam)
    {
        var m = new TruthMatch(MicroscopeFields.Make(11, s => MicroscopeFields.With(s, []) is var c ? new MicroscopeFieldSpec { Width = s.Width, Height = s.Height, Seed = s.Seed, RimYield = rim, DoseElectronsPerPixel = dose, BeamSigmaPx = beam, ScanJitterPx = dose > 0 ? 0.15 : 0, DriftFraction = dose > 0 ? 0.1 : 0, TextureFraction = dose > 0 ? 0.06 : 0 } : s, scene: new MicroscopeSceneOptions { Seed = 11, MinRadiusPx = 4, MaxRadiusPx = 20, Units = 300 }));
        var plain = m.PlainIsolated().ToList();
        var found = plain.Where(p => p.Found is not null).ToList();
        output.WriteLine($"found {m.Analysis.Wires.Count} thr {m.Analysis.Threshold} band {m.Analysis.ExcludedBottomRows} notes {string.Join("/", m.Analysis.Notes)}; sigma {m.Analysis.EdgeSigmaPixels:0.000}; plain {plain.Count} found {found.Count} vertical {found.Count(p => p.Found!.Class == WireClass.Vertical)}");
        var errs = found.Select(p => (p.Truth.EquivalentRadius, p.Found!.EquivalentRadius - p.Truth.EquivalentRadius)).ToList();
        foreach (var (lo, hi) in new[] { (4.0, 8.0), (8.0, 12.0), (12.0, 20.0) })
        {
            var bin = errs.Where(e => e.Item1 >= lo && e.Item1 < hi).Select(e => e.Item2).OrderBy(x => x).ToList();
            output.WriteLine($"bin {lo}-{hi}: n {bin.Count} median err {bin[bin.Count / 2]:+0.000;-0.000} px, rel {found.Where(p => p.Truth.EquivalentRadius >= lo && p.Truth.EquivalentRadius < hi).Select(p => p.Found!.EquivalentRadius / p.Truth.EquivalentRadius - 1).OrderBy(x => x).ElementAt(bin.Count / 2) * 100:+0.00;-0.00}%");
        }
        foreach (var (t, f) in found.OrderBy(p => p.Truth.EquivalentRadius).Take(0))
        {
            output.WriteLine($"r {t.EquivalentRadius:0.00} edge {f!.EquivalentRadius:0.00} ({(f.EquivalentRadius / t.EquivalentRadius - 1) * 100:+0.0;-0.0}%) thr {f.ThresholdRadius:0.00} {f.Class} irr {f.Irregularity:0.000} rc {f.RelativeContrast:0.00} {f.RadiusMethod}");
        }
        foreach (var (t, f) in m.Pairs.Where(p => p.Truth.Kind == SemObjectKind.Parasitic).Take(0))
        {
            output.WriteLine($"crystal r {t.EquivalentRadius:0.0} -> {f?.Class} irr {f?.Irregularity:0.000} rc {f?.RelativeContrast:0.00} sol {f?.Solidity:0.00} ar {f?.AspectRatio:0.00}");
        }
    }
}
