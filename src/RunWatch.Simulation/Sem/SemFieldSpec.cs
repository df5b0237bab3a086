namespace RunWatch.Simulation.Sem;

/// <summary>
/// What to draw in a synthetic top-down SEM field (invented data for tests, benchmarks and the demo).
/// Deterministic: the same spec and seed give the same pixels.
/// </summary>
public sealed class SemFieldSpec
{
    public int Width { get; init; } = 1024;

    public int Height { get; init; } = 768;

    /// <summary>Pixel size written to the sidecar.</summary>
    public double PixelSizeNm { get; init; } = 5;

    public int Seed { get; init; } = 1;

    /// <summary>Wire sites in pixels.</summary>
    public IReadOnlyList<(double X, double Y)> Sites { get; init; } = [];

    /// <summary>Hexagon side a in pixels of the wire at site i (its circumradius; equivalent radius 0.909a).</summary>
    public Func<int, double> SideOfSite { get; init; } = _ => 8;

    /// <summary>Share of sites drawn as tilted (elongated) wires.</summary>
    public double TiltedFraction { get; init; } = 0.05;

    /// <summary>Parasitic clusters added at random places, per 1000 sites.</summary>
    public double ParasiticPerThousandSites { get; init; } = 10;

    /// <summary>Rows of the information strip at the bottom (0 for none).</summary>
    public int InfoStripRows { get; init; } = 48;

    /// <summary>Background level (16-bit), gradient across the field, noise SD.</summary>
    public double Background { get; init; } = 9000;

    public double GradientAmplitude { get; init; } = 4000;

    public double NoiseSigma { get; init; } = 900;

    /// <summary>Brightness added by a wire top and by its droplet.</summary>
    public double TopBrightness { get; init; } = 22000;

    public double DropletBrightness { get; init; } = 12000;
}
