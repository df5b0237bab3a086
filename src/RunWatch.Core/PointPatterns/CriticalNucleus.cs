namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Critical nucleus size suggested by a fitted β, under a named <see cref="CriticalNucleusMapping"/>. Interpretation
/// only: besides the authors' own change from i + 1 to i + 2, Shi, Shim &amp; Amar (2009, Phys. Rev. E 79, 011602) report
/// poor agreement of the Wigner form with the asymptotic distribution for point islands (CONFIRMED, CHECKS.md §4).
/// </summary>
public static class CriticalNucleus
{
    /// <summary>i for <paramref name="beta"/> (not rounded: a fitted β is rarely an integer plus the offset).</summary>
    public static double FromBeta(double beta, CriticalNucleusMapping mapping) => mapping switch
    {
        CriticalNucleusMapping.EinsteinPimpinelliGonzalez2014 => beta - 2.0,
        CriticalNucleusMapping.PimpinelliEinstein2007 => beta - 1.0,
        _ => throw new ArgumentOutOfRangeException(nameof(mapping), mapping, "unknown mapping"),
    };

    /// <summary>β expected for critical nucleus size <paramref name="i"/>.</summary>
    public static double ToBeta(double i, CriticalNucleusMapping mapping) => mapping switch
    {
        CriticalNucleusMapping.EinsteinPimpinelliGonzalez2014 => i + 2.0,
        CriticalNucleusMapping.PimpinelliEinstein2007 => i + 1.0,
        _ => throw new ArgumentOutOfRangeException(nameof(mapping), mapping, "unknown mapping"),
    };

    /// <summary>One line for reports, naming the formula and its source.</summary>
    public static string Describe(CriticalNucleusMapping mapping) => mapping switch
    {
        CriticalNucleusMapping.EinsteinPimpinelliGonzalez2014 => "i = β − 2 (Einstein, Pimpinelli & González 2014)",
        CriticalNucleusMapping.PimpinelliEinstein2007 => "i = β − 1 (Pimpinelli & Einstein 2007)",
        _ => throw new ArgumentOutOfRangeException(nameof(mapping), mapping, "unknown mapping"),
    };
}
