namespace RunWatch.Core.PointPatterns;

/// <summary>How nearest-neighbour statistics treat the field edge.</summary>
public enum EdgeRule
{
    /// <summary>
    /// No correction: points near the edge have their nearest neighbour cut off, so the mean distance and R come
    /// out high — about +1.3 % for 1000 points in a square (Donnelly 1978, constants FROM MEMORY; CHECKS.md §2).
    /// </summary>
    None,

    /// <summary>
    /// Guard region (border method): only points at least the guard width from the edge and the excluded band
    /// are reference points; all points serve as neighbours. Unbiased while the guard exceeds almost every
    /// nearest-neighbour distance.
    /// </summary>
    GuardRegion,

    /// <summary>Periodic field (torus): no edge. Only for simulated patterns in a periodic <c>CaptureField</c>.</summary>
    Periodic,
}
