using RunWatch.Simulation.Sem;

namespace RunWatch.Imaging.Tests.Support;

/// <summary>Fields from the microscope-like generator (invented data), seeded; effects switched per case.</summary>
internal static class MicroscopeFields
{
    public static MicroscopeField Make(int seed, Func<MicroscopeFieldSpec, MicroscopeFieldSpec>? effects = null, MicroscopeSceneOptions? scene = null,
        int width = 1024, int height = 768, double tiltDeg = 0, bool stripAtTop = false)
    {
        var baseSpec = new MicroscopeFieldSpec { Width = width, Height = height, Seed = seed, TiltDeg = tiltDeg, StripAtTop = stripAtTop };
        baseSpec = effects?.Invoke(baseSpec) ?? baseSpec;
        IReadOnlyList<MicroscopeObject> objects = MicroscopeScene.Build(baseSpec, scene ?? new MicroscopeSceneOptions { Seed = seed });
        return MicroscopeFieldGenerator.Generate(With(baseSpec, objects));
    }

    /// <summary>A copy of <paramref name="s"/> with other objects.</summary>
    public static MicroscopeFieldSpec With(MicroscopeFieldSpec s, IReadOnlyList<MicroscopeObject> objects) => new()
    {
        Width = s.Width, Height = s.Height, PixelSizeNm = s.PixelSizeNm, Seed = s.Seed, Objects = objects, TiltDeg = s.TiltDeg,
        TopYield = s.TopYield, RimYield = s.RimYield, RimWidthPx = s.RimWidthPx, DropletYield = s.DropletYield, MaxSecantGain = s.MaxSecantGain,
        BeamSigmaPx = s.BeamSigmaPx, DoseElectronsPerPixel = s.DoseElectronsPerPixel, ScanJitterPx = s.ScanJitterPx, DriftFraction = s.DriftFraction,
        TextureFraction = s.TextureFraction, TextureScalePx = s.TextureScalePx, StripRows = s.StripRows, StripAtTop = s.StripAtTop, ScaleBarNm = s.ScaleBarNm,
    };
}
