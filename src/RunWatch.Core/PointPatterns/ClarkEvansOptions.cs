namespace RunWatch.Core.PointPatterns;

/// <summary>Settings for <see cref="ClarkEvans.Compute"/>.</summary>
public sealed record ClarkEvansOptions
{
    /// <summary>Edge treatment; ignored for a periodic field, which is always <see cref="PointPatterns.EdgeRule.Periodic"/>.</summary>
    /// <value>Default <see cref="PointPatterns.EdgeRule.GuardRegion"/>.</value>
    public EdgeRule EdgeRule { get; init; } = EdgeRule.GuardRegion;

    /// <summary>
    /// Guard width in the points' unit for <see cref="PointPatterns.EdgeRule.GuardRegion"/>; NaN picks
    /// 1.5/√λ (three expected mean distances: under complete spatial randomness a nearest neighbour is farther
    /// with probability exp(−2.25π) ≈ 0.09 %, DERIVED).
    /// </summary>
    /// <value>Default NaN (automatic).</value>
    public double GuardWidth { get; init; } = double.NaN;
}
