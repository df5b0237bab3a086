namespace RunWatch.Core.PointPatterns;

/// <summary>Fit of the generalised Wigner surmise to one set of zone areas.</summary>
/// <param name="Count">Areas given.</param>
/// <param name="UsedCount">Normalised areas inside the fitting window (all, without a window).</param>
/// <param name="Beta">Maximum-likelihood β.</param>
/// <param name="BetaLower">Lower end of the profile-likelihood interval (the search bound if the likelihood never drops far enough).</param>
/// <param name="BetaUpper">Upper end of the interval.</param>
/// <param name="ConfidenceLevel">Level of the interval.</param>
/// <param name="AtSearchBound">True when the estimate sits at MinBeta or MaxBeta: the data do not look like P_β.</param>
/// <param name="MomentBeta">β solving Var(s) = (β+1)/(2b_β) − 1 for the sample variance of all s; NaN when the variance lies outside what β in the search range gives.</param>
/// <param name="SampleVariance">Sample variance of s = A/⟨A⟩ (n − 1 denominator).</param>
/// <param name="MinS">Fitting window, lower end.</param>
/// <param name="MaxS">Fitting window, upper end.</param>
/// <param name="Mapping">Mapping used for <paramref name="CriticalNucleusSize"/>.</param>
/// <param name="CriticalNucleusSize">i suggested by <paramref name="Beta"/> under <paramref name="Mapping"/> (interpretation only; disputed).</param>
/// <param name="MappingDescription">The mapping as a formula with its source, for display.</param>
public sealed record WignerFitResult(
    int Count,
    int UsedCount,
    double Beta,
    double BetaLower,
    double BetaUpper,
    double ConfidenceLevel,
    bool AtSearchBound,
    double MomentBeta,
    double SampleVariance,
    double MinS,
    double MaxS,
    CriticalNucleusMapping Mapping,
    double CriticalNucleusSize,
    string MappingDescription);
