namespace RunWatch.Core.PointPatterns;

/// <summary>
/// How a fitted Wigner-surmise exponent β is read as a critical nucleus size i in two dimensions. The mapping is
/// disputed in the literature, so it is a setting and every result names the one it used. Interpretation only.
/// </summary>
public enum CriticalNucleusMapping
{
    /// <summary>i = β − 2: Einstein, Pimpinelli &amp; González (2014), J. Cryst. Growth 401, 67 (review; FROM MEMORY for volume and page).</summary>
    EinsteinPimpinelliGonzalez2014,

    /// <summary>i = β − 1: the original proposal β = i + 1 of Pimpinelli &amp; Einstein (2007), Phys. Rev. Lett. 99, 226102 (FROM MEMORY for volume and page).</summary>
    PimpinelliEinstein2007,
}
