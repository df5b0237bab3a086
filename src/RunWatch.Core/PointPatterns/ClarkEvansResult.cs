namespace RunWatch.Core.PointPatterns;

/// <summary>Clark–Evans aggregation index of one field (Clark &amp; Evans 1954).</summary>
/// <param name="PointCount">All points.</param>
/// <param name="ReferenceCount">Points whose nearest-neighbour distance entered the mean (all, unless a guard region was used).</param>
/// <param name="Density">λ = points per unit² of the observed window (field minus excluded band).</param>
/// <param name="MeanDistance">r̄_A, the observed mean nearest-neighbour distance.</param>
/// <param name="ExpectedMeanDistance">r̄_E = 1/(2√λ), the mean under complete spatial randomness.</param>
/// <param name="Ratio">R = r̄_A / r̄_E: below 1 clustered, 1 random, above 1 ordered (2 for a square lattice, 2.1491 triangular).</param>
/// <param name="StandardError">σ = 0.26136 / √(n·λ), n = reference count.</param>
/// <param name="Z">z = (r̄_A − r̄_E) / σ.</param>
/// <param name="PValue">Two-sided p-value of z under the normal approximation.</param>
/// <param name="EdgeRule">Edge treatment used.</param>
/// <param name="GuardWidth">Guard width used (0 unless <see cref="PointPatterns.EdgeRule.GuardRegion"/>).</param>
public sealed record ClarkEvansResult(
    int PointCount,
    int ReferenceCount,
    double Density,
    double MeanDistance,
    double ExpectedMeanDistance,
    double Ratio,
    double StandardError,
    double Z,
    double PValue,
    EdgeRule EdgeRule,
    double GuardWidth);
