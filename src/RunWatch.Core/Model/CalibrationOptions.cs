namespace RunWatch.Core.Model;

/// <summary>Settings of <see cref="ProcessCalibrator"/>.</summary>
public sealed record CalibrationOptions
{
    /// <summary>Smallest capture radius searched (nm).</summary>
    /// <value>20 nm.</value>
    public double MinCaptureRadiusNm { get; init; } = 20;

    /// <summary>Largest capture radius searched (nm).</summary>
    /// <value>20 000 nm (the plausibility band's upper end).</value>
    public double MaxCaptureRadiusNm { get; init; } = 20_000;

    /// <summary>Coarse scan points of the L search.</summary>
    /// <value>24.</value>
    public int ScanPoints { get; init; } = 24;

    /// <summary>
    /// Model form whose r² the L search maximises, or null to search with both forms and keep the (L, form) pair
    /// with the higher r² (equal parameter counts, so this agrees with the AIC selection).
    /// </summary>
    /// <value>null.</value>
    public RadiusModelKind? SearchModel { get; init; }

    /// <summary>Throws <see cref="ArgumentException"/> when a setting is out of range.</summary>
    public void Validate()
    {
        if (!(MinCaptureRadiusNm > 0) || !(MaxCaptureRadiusNm > MinCaptureRadiusNm) || !double.IsFinite(MaxCaptureRadiusNm))
        {
            throw new ArgumentException($"Need 0 < MinCaptureRadiusNm < MaxCaptureRadiusNm < ∞; got {MinCaptureRadiusNm}, {MaxCaptureRadiusNm}.");
        }
        if (ScanPoints < 3)
        {
            throw new ArgumentException($"ScanPoints must be ≥ 3; got {ScanPoints}.");
        }
        if (SearchModel is { } kind && !Enum.IsDefined(kind))
        {
            throw new ArgumentException($"Unknown SearchModel {SearchModel}.");
        }
    }
}
