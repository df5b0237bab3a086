namespace RunWatch.Imaging.Analysis;

/// <summary>
/// Statistics of one field. Counts and shapes use interior objects only (not touching the image edge or the
/// excluded band); density counts every object whose centroid lies in the analysed area (an unbiased counting
/// rule). Lengths are in <see cref="FieldAnalysis.LengthUnit"/>.
/// </summary>
public sealed record FieldStatistics
{
    /// <summary>Objects found, including those touching the border.</summary>
    public required int ObjectsFound { get; init; }

    public required int ObjectsTouchingBorder { get; init; }

    /// <summary>Interior objects (the ones the statistics use).</summary>
    public required int InteriorObjects { get; init; }

    public required int Vertical { get; init; }

    public required int Elongated { get; init; }

    public required int Oversized { get; init; }

    public required int Irregular { get; init; }

    /// <summary>Vertical / interior objects; NaN when there are none.</summary>
    public required double VerticalYield { get; init; }

    /// <summary>Analysed area (image less the excluded band) in px².</summary>
    public required double AnalysedAreaPixels { get; init; }

    /// <summary>Objects per px².</summary>
    public required double DensityPerPixel2 { get; init; }

    /// <summary>Objects per µm², with a scale.</summary>
    public double? DensityPerUm2 { get; init; }

    /// <summary>Objects per cm², with a scale.</summary>
    public double? DensityPerCm2 { get; init; }

    /// <summary>Vertical wires per cm², with a scale.</summary>
    public double? VerticalDensityPerCm2 { get; init; }

    /// <summary>Equivalent-circle radius of interior vertical wires; null when there are none.</summary>
    public DistributionSummary? Radius { get; init; }

    /// <summary>Distance from each interior wire's centroid to the nearest other centroid.</summary>
    public DistributionSummary? NearestNeighbourDistance { get; init; }

    /// <summary>Clark–Evans ratio R of the wire centroids, when computed.</summary>
    public double? ClarkEvansR { get; init; }

    /// <summary>z-score of <see cref="ClarkEvansR"/> against complete spatial randomness.</summary>
    public double? ClarkEvansZ { get; init; }

    /// <summary>Diffusion length used for zones, in the length unit.</summary>
    public double? DiffusionLength { get; init; }

    /// <summary>Normalised edge-based zone areas Â = A/(πL²) of unguarded interior wires.</summary>
    public DistributionSummary? EdgeZoneNormalized { get; init; }

    /// <summary>Normalised centroid-based zone areas of unguarded wires.</summary>
    public DistributionSummary? CentroidZoneNormalized { get; init; }

    /// <summary>Generalised Wigner surmise β fitted to s = A/⟨A⟩ of the unguarded centroid zones.</summary>
    public double? WignerBeta { get; init; }

    /// <summary>Critical nucleus size suggested by β, an interpretation only (see <see cref="WignerMapping"/>).</summary>
    public double? CriticalNucleus { get; init; }

    /// <summary>Which β → i mapping <see cref="CriticalNucleus"/> used.</summary>
    public string? WignerMapping { get; init; }
}
