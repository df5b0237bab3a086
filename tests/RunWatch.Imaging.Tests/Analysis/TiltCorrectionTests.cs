using RunWatch.Imaging.Measurement;
using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Imaging.Tests.Analysis;

/// <summary>Stage tilt: the generator foreshortens the sample plane by cos θ along y; the analysis must undo it (DERIVED).</summary>
public sealed class TiltCorrectionTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(20)]
    [InlineData(45)]
    public void Analyze_TiltedField_PositionsShapesAndDensityInTheSamplePlane(double tilt)
    {
        var spec = new MicroscopeFieldSpec { Width = 1024, Height = 768, Seed = 81, TiltDeg = tilt };
        var scene = new MicroscopeSceneOptions { Seed = 81, MinRadiusPx = 6, MaxRadiusPx = 11, Units = 240 };
        var m = new TruthMatch(MicroscopeFieldGenerator.Generate(MicroscopeFields.With(spec, MicroscopeScene.Build(spec, scene))));
        double cos = Math.Cos(tilt * Math.PI / 180);
        var plain = m.PlainIsolated().Where(p => p.Found is not null).ToList();
        double[] dy = plain.Select(p => Math.Abs(p.Found!.CentroidY - (p.Truth.Y / cos))).OrderBy(x => x).ToArray();
        int vertical = plain.Count(p => p.Found!.Class == WireClass.Vertical);
        double[] aspect = plain.Select(p => p.Found!.AspectRatio).OrderBy(x => x).ToArray();
        double planeArea = m.Field.Width * (m.Field.Height - m.Analysis.ExcludedBottomRows) / cos;
        output.WriteLine($"tilt {tilt}°: {plain.Count} plain wires, {vertical} vertical; |Δy| median {dy[dy.Length / 2]:0.00} px, P90 {dy[(int)(0.9 * dy.Length)]:0.00}; aspect median {aspect[aspect.Length / 2]:0.000}; density {m.Analysis.Statistics.DensityPerPixel2 * 1e6:0.0} vs {m.Analysis.Wires.Count / planeArea * 1e6:0.0} per 10⁶ px²");
        Assert.InRange(dy[(int)(0.9 * dy.Length)], 0, 0.5);
        // A regular hexagon's rays give a max/min diameter ratio of 2/√3 ≈ 1.155 at most; foreshortened by cos 45° uncorrected it would be ≈ 1.5.
        Assert.InRange(aspect[aspect.Length / 2], 1.0, 1.2);
        Assert.True(vertical >= 0.98 * plain.Count, $"{vertical} of {plain.Count} vertical");
        Assert.Equal(m.Analysis.Wires.Count / planeArea, m.Analysis.Statistics.DensityPerPixel2, 1e-3 * m.Analysis.Statistics.DensityPerPixel2);
    }
}
