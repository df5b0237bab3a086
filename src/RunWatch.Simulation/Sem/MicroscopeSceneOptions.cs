namespace RunWatch.Simulation.Sem;

/// <summary>What <see cref="MicroscopeScene.Build"/> scatters over a field (invented data). Fractions are of placed units.</summary>
public sealed class MicroscopeSceneOptions
{
    public int Seed { get; init; } = 1;

    /// <summary>Units to place: single wires, touching groups, tilted wires and crystallites together.</summary>
    public int Units { get; init; } = 400;

    /// <summary>Range of wire radius (equivalent radius of the hexagonal top, sample-plane pixels), drawn uniformly.</summary>
    public double MinRadiusPx { get; init; } = 4;

    public double MaxRadiusPx { get; init; } = 12;

    /// <summary>Smallest clear gap between units, pixels.</summary>
    public double GapPx { get; init; } = 4;

    public double FaceToFaceFraction { get; init; } = 0.04;

    public double CornerToCornerFraction { get; init; } = 0.04;

    public double ChainFraction { get; init; } = 0.02;

    public double TiltedFraction { get; init; } = 0.04;

    public double CrystalliteFraction { get; init; } = 0.12;

    /// <summary>Share of single vertical wires that carry a droplet of 0.5–0.8 times the facet side, the facet visible around it.</summary>
    public double VisibleFacetDropletFraction { get; init; } = 0.15;

    /// <summary>Share of single vertical wires whose droplet hides the facet: r_drop = r_wire / sin θ (<see cref="ContactAngleDeg"/>).</summary>
    public double DropletOnlyFraction { get; init; } = 0.1;

    /// <summary>Contact angle θ of the hiding droplets, degrees (&gt; 90°).</summary>
    public double ContactAngleDeg { get; init; } = 130;
}
