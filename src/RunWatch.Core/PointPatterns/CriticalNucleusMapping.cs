namespace RunWatch.Core.PointPatterns;

/// <summary>
/// How a fitted Wigner-surmise exponent β is read as a critical nucleus size i in two dimensions. The mapping is
/// disputed in the literature, so it is a setting and every result names the one it used. Interpretation only.
/// </summary>
public enum CriticalNucleusMapping
{
    /// <summary>i = β − 2: the authors' review, Einstein, Pimpinelli &amp; González (2014), J. Cryst. Growth 401, 67–71, "β ≈ i + 2" (CONFIRMED, CHECKS.md §4).</summary>
    EinsteinPimpinelliGonzalez2014,

    /// <summary>
    /// i = β − 1: the original two-dimensional proposal β = i + 1 (2006 preprint: β = i + d/2, CONFIRMED; Pimpinelli &amp;
    /// Einstein (2007), Phys. Rev. Lett. 99, 226102, citation CONFIRMED, its formula β = (2/d)(i + 1) FROM MEMORY).
    /// </summary>
    PimpinelliEinstein2007,
}
