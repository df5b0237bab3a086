namespace RunWatch.Simulation.Sem;

/// <summary>
/// How <see cref="MicroscopeFieldGenerator"/> images a scene (invented data): secondary-electron yields, the edge
/// effect, beam blur, shot noise at a dose, scan-line jitter, charging drift, substrate texture, stage tilt and the
/// information strip. Yields are relative to the flat substrate (1). Deterministic from <see cref="Seed"/>.
/// </summary>
public sealed class MicroscopeFieldSpec
{
    public int Width { get; init; } = 1024;

    public int Height { get; init; } = 768;

    /// <summary>Pixel size written to the sidecar, nm.</summary>
    public double PixelSizeNm { get; init; } = 10;

    public int Seed { get; init; } = 1;

    /// <summary>What to draw (usually from <see cref="MicroscopeScene.Build"/>).</summary>
    public IReadOnlyList<MicroscopeObject> Objects { get; init; } = [];

    /// <summary>Stage tilt, degrees: the sample plane is foreshortened by cos θ along y (the tilt axis is x).</summary>
    public double TiltDeg { get; init; }

    /// <summary>Secondary-electron yield of a flat wire top relative to the substrate.</summary>
    public double TopYield { get; init; } = 1.7;

    /// <summary>Extra yield at a top's edge (edge effect: electrons escape through the side wall), decaying inwards as exp(−d/<see cref="RimWidthPx"/>). 0 turns rims off.</summary>
    public double RimYield { get; init; } = 0.8;

    public double RimWidthPx { get; init; } = 1.5;

    /// <summary>Yield of a droplet's top; its slopes brighten as 1/cos α (secant law), capped at <see cref="MaxSecantGain"/>.</summary>
    public double DropletYield { get; init; } = 2.3;

    public double MaxSecantGain { get; init; } = 2.0;

    /// <summary>Gaussian beam profile, σ in pixels.</summary>
    public double BeamSigmaPx { get; init; } = 0.8;

    /// <summary>Mean primary-to-detected electrons per pixel on the substrate; counts are Poisson. 0 = noise-free.</summary>
    public double DoseElectronsPerPixel { get; init; } = 40;

    /// <summary>SD of each scan line's horizontal offset, pixels.</summary>
    public double ScanJitterPx { get; init; } = 0.15;

    /// <summary>Relative amplitude of the slow charging drift of the signal gain over the frame time.</summary>
    public double DriftFraction { get; init; } = 0.1;

    /// <summary>Relative SD of the substrate's texture (grain), and its correlation length in pixels.</summary>
    public double TextureFraction { get; init; } = 0.06;

    public double TextureScalePx { get; init; } = 3;

    /// <summary>Rows of the drawn information strip (0 = none) and whether it sits at the top.</summary>
    public int StripRows { get; init; } = 56;

    public bool StripAtTop { get; init; }

    /// <summary>Length the strip's scale bar stands for, nm; the bar is drawn at this length ÷ <see cref="PixelSizeNm"/> pixels (round).</summary>
    public double ScaleBarNm { get; init; } = 1000;

    /// <summary>Rows usable for the sample (above or below the strip).</summary>
    public int SampleRows => Height - Math.Clamp(StripRows, 0, Height);

    /// <summary>First sample row: the strip's height when it sits at the top, else 0.</summary>
    public int SampleTop => StripAtTop ? Math.Clamp(StripRows, 0, Height) : 0;
}
