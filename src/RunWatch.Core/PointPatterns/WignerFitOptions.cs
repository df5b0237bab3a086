namespace RunWatch.Core.PointPatterns;

/// <summary>Settings for <see cref="WignerSurmiseFit.Fit"/>.</summary>
public sealed record WignerFitOptions
{
    /// <summary>
    /// Lower end of the fitting window in s = A/⟨A⟩. With a window the likelihood is that of P_β truncated to it
    /// (tails, where small-number and edge effects live, are left out; CHECKS.md §4 suggests 0.5 &lt; s &lt; 2).
    /// </summary>
    /// <value>Default 0 (no lower cut).</value>
    public double MinS { get; init; }

    /// <summary>Upper end of the fitting window in s.</summary>
    /// <value>Default +∞ (no upper cut).</value>
    public double MaxS { get; init; } = double.PositiveInfinity;

    /// <summary>Confidence level of the profile-likelihood interval for β.</summary>
    /// <value>Default 0.95.</value>
    public double ConfidenceLevel { get; init; } = 0.95;

    /// <summary>Smallest β searched.</summary>
    /// <value>Default 0.</value>
    public double MinBeta { get; init; }

    /// <summary>Largest β searched.</summary>
    /// <value>Default 60.</value>
    public double MaxBeta { get; init; } = 60.0;

    /// <summary>How β is read as a critical nucleus size (interpretation only).</summary>
    /// <value>Default <see cref="CriticalNucleusMapping.EinsteinPimpinelliGonzalez2014"/> (i = β − 2).</value>
    public CriticalNucleusMapping Mapping { get; init; } = CriticalNucleusMapping.EinsteinPimpinelliGonzalez2014;

    /// <summary>Throws <see cref="ArgumentException"/> when a setting is out of range.</summary>
    public void Validate()
    {
        if (double.IsNaN(MinS) || double.IsNaN(MaxS) || MinS < 0.0 || !(MaxS > MinS))
        {
            throw new ArgumentException($"fitting window must satisfy 0 <= MinS < MaxS (got {MinS}, {MaxS})");
        }
        if (!(ConfidenceLevel > 0.0 && ConfidenceLevel < 1.0))
        {
            throw new ArgumentException($"confidence level must be in (0, 1) (got {ConfidenceLevel})");
        }
        if (!double.IsFinite(MinBeta) || !double.IsFinite(MaxBeta) || MinBeta <= -1.0 || !(MaxBeta > MinBeta))
        {
            throw new ArgumentException($"β range must satisfy -1 < MinBeta < MaxBeta, both finite (got {MinBeta}, {MaxBeta})");
        }
        if (!Enum.IsDefined(Mapping))
        {
            throw new ArgumentException($"unknown critical nucleus mapping {Mapping}");
        }
    }
}
