using RunWatch.Imaging.Tests.Support;
using RunWatch.Simulation.Sem;
using Xunit;

namespace RunWatch.Imaging.Tests.Simulation;

public sealed class MicroscopeFieldGeneratorTests
{
    private static MicroscopeFieldSpec Ideal(IReadOnlyList<MicroscopeObject> objects, double tilt = 0) => new()
    {
        Width = 96, Height = 96, Objects = objects, RimYield = 0, BeamSigmaPx = 0, DoseElectronsPerPixel = 0, ScanJitterPx = 0,
        DriftFraction = 0, TextureFraction = 0, StripRows = 0, TiltDeg = tilt,
    };

    [Theory]
    [InlineData(6.3, 0, 0)]
    [InlineData(11.7, 17, 0)]
    [InlineData(9.1, 41, 35)]
    public void Generate_IdealHexagon_SignalIntegratesToTheClosedFormArea(double side, double angle, double tilt)
    {
        // DERIVED: with every effect off a pixel holds substrate + (top − substrate) × covered fraction, so the summed
        // excess over the substrate is (3√3/2)a² × cos θ (the tilt foreshortens y).
        var hexagon = new MicroscopeObject { Kind = SemObjectKind.Vertical, X = 47.3, Y = 48.6, Size = side, AngleDeg = angle };
        MicroscopeField field = MicroscopeFieldGenerator.Generate(Ideal([hexagon], tilt));
        MicroscopeField empty = MicroscopeFieldGenerator.Generate(Ideal([], tilt));
        MicroscopeField full = MicroscopeFieldGenerator.Generate(Ideal([hexagon with { Size = 200 }], tilt));
        double substrate = empty.Pixels[0], top = full.Pixels[0];
        double covered = field.Pixels.Sum(p => (p - substrate) / (top - substrate));
        double expected = hexagon.TrueArea * Math.Cos(tilt * Math.PI / 180);
        // 4 × 4 supersampling and 16-bit rounding: a tolerance of 1 % of the area.
        Assert.InRange(covered, expected * 0.99, expected * 1.01);
    }

    [Fact]
    public void Generate_SameSeed_GivesSamePixels()
    {
        Assert.Equal(MicroscopeFields.Make(5, s => new MicroscopeFieldSpec { Width = 320, Height = 240, Seed = 5, ScaleBarNm = 500 }, width: 320, height: 240).Pixels, MicroscopeFields.Make(5, s => new MicroscopeFieldSpec { Width = 320, Height = 240, Seed = 5, ScaleBarNm = 500 }, width: 320, height: 240).Pixels);
        Assert.NotEqual(MicroscopeFields.Make(5, s => new MicroscopeFieldSpec { Width = 320, Height = 240, Seed = 5, ScaleBarNm = 500 }, width: 320, height: 240).Pixels, MicroscopeFields.Make(6, s => new MicroscopeFieldSpec { Width = 320, Height = 240, Seed = 6, ScaleBarNm = 500 }, width: 320, height: 240).Pixels);
    }

    [Fact]
    public void Generate_ShotNoise_VarianceFollowsTheDose()
    {
        // Poisson counts: on the flat substrate (no texture, drift or blur) variance/mean² of the counts is 1/dose.
        foreach (double dose in new[] { 10.0, 50.0 })
        {
            MicroscopeField field = MicroscopeFieldGenerator.Generate(Ideal([]) is var s ? new MicroscopeFieldSpec
            {
                Width = 256, Height = 256, RimYield = 0, BeamSigmaPx = 0, DoseElectronsPerPixel = dose, ScanJitterPx = 0, DriftFraction = 0,
                TextureFraction = 0, StripRows = 0,
            } : null!);
            double[] v = field.Pixels.Select(p => p - 1500.0).ToArray();
            double mean = v.Average(), variance = v.Sum(x => (x - mean) * (x - mean)) / (v.Length - 1);
            Assert.InRange(variance / (mean * mean), 0.93 / dose, 1.07 / dose);
        }
    }

    [Fact]
    public void Generate_StripWithScaleBar_DrawsTheBarAtItsLength()
    {
        MicroscopeField field = MicroscopeFields.Make(4, s => new MicroscopeFieldSpec { Width = 640, Height = 480, Seed = 4, ScaleBarNm = 1500, PixelSizeNm = 10 },
            new MicroscopeSceneOptions { Seed = 4, Units = 100 }, 640, 480);
        Assert.Equal(150, field.ScaleBarPixels);
        Assert.True(field.Objects.Count >= 100);
        Assert.All(field.Objects, o => Assert.InRange(o.Y, 0, 480 - 56));
    }
}
