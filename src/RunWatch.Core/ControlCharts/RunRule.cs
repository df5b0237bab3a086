namespace RunWatch.Core.ControlCharts;

/// <summary>
/// The four run rules of the Western Electric Statistical Quality Control Handbook (1956) for a Shewhart chart
/// with zones at 1, 2 and 3 σ around the centre line (FROM MEMORY; the rules are widely reprinted, e.g. in
/// NIST/SEMATECH e-Handbook of Statistical Methods, section 6.3.2).
/// </summary>
public enum RunRule
{
    /// <summary>Rule 1: one point beyond 3 σ.</summary>
    OneBeyondThreeSigma = 1,

    /// <summary>Rule 2: two of three consecutive points beyond 2 σ on the same side.</summary>
    TwoOfThreeBeyondTwoSigma = 2,

    /// <summary>Rule 3: four of five consecutive points beyond 1 σ on the same side.</summary>
    FourOfFiveBeyondOneSigma = 3,

    /// <summary>Rule 4: eight consecutive points on the same side of the centre line.</summary>
    EightOnOneSide = 4,
}
