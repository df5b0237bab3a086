namespace RunWatch.Core.Qc;

/// <summary>
/// QC specification of one recipe, bound from configuration (section <c>Qc:Recipes:{recipe}</c>). Every limit is
/// optional: a null limit switches its rule off. Each rule has a fail limit and an optional, stricter warn limit;
/// a value beyond the warn limit but within the fail limit warns. Fractions are 0..1, not percent.
/// </summary>
public sealed class QcSpecification
{
    /// <summary>Lower bound (exclusive) of <see cref="DropletContactAngleDeg"/>: at 90° the droplet's equator sits on the facet edge.</summary>
    public const double MinDropletContactAngleDeg = 90;

    /// <summary>Upper bound (exclusive) of <see cref="DropletContactAngleDeg"/>: at 180° the droplet would not wet the top at all.</summary>
    public const double MaxDropletContactAngleDeg = 180;

    /// <summary>Target mean wire radius (nm).</summary>
    public double? TargetMeanRadiusNm { get; set; }

    /// <summary>Fail when |mean − target| exceeds this (nm).</summary>
    public double? MeanRadiusToleranceNm { get; set; }

    /// <summary>Warn when |mean − target| exceeds this (nm); ≤ the tolerance.</summary>
    public double? MeanRadiusWarnToleranceNm { get; set; }

    /// <summary>Fail when the radius CV exceeds this (fraction).</summary>
    public double? MaxRadiusCv { get; set; }

    /// <summary>Warn when the radius CV exceeds this (fraction); ≤ <see cref="MaxRadiusCv"/>.</summary>
    public double? WarnRadiusCv { get; set; }

    /// <summary>Fail below this wire density (cm⁻²).</summary>
    public double? MinDensityPerCm2 { get; set; }

    /// <summary>Fail above this wire density (cm⁻²).</summary>
    public double? MaxDensityPerCm2 { get; set; }

    /// <summary>Warn below this density (cm⁻²); inside the fail window.</summary>
    public double? WarnMinDensityPerCm2 { get; set; }

    /// <summary>Warn above this density (cm⁻²); inside the fail window.</summary>
    public double? WarnMaxDensityPerCm2 { get; set; }

    /// <summary>Fail when the vertical yield is below this (fraction).</summary>
    public double? MinVerticalYield { get; set; }

    /// <summary>Warn when the vertical yield is below this (fraction); ≥ <see cref="MinVerticalYield"/>.</summary>
    public double? WarnVerticalYield { get; set; }

    /// <summary>Fail when |predicted − measured| mean radius bias exceeds this (nm).</summary>
    public double? MaxAbsBiasNm { get; set; }

    /// <summary>Warn when |bias| exceeds this (nm); ≤ <see cref="MaxAbsBiasNm"/>.</summary>
    public double? WarnAbsBiasNm { get; set; }

    /// <summary>Fail when more excursions than this occurred in the growth window.</summary>
    public int? MaxExcursionCount { get; set; }

    /// <summary>Warn when more excursions than this occurred; ≤ <see cref="MaxExcursionCount"/>.</summary>
    public int? WarnExcursionCount { get; set; }

    /// <summary>Fail when one excursion changed L by more than this fraction (|ΔL/L|).</summary>
    public double? MaxAbsRelativeLChange { get; set; }

    /// <summary>Warn above this |ΔL/L|; ≤ <see cref="MaxAbsRelativeLChange"/>.</summary>
    public double? WarnAbsRelativeLChange { get; set; }

    /// <summary>Fail when the thermal record covers less of the growth window than this (fraction).</summary>
    public double? MinThermalCoverage { get; set; }

    /// <summary>Warn below this coverage (fraction); ≥ <see cref="MinThermalCoverage"/>.</summary>
    public double? WarnThermalCoverage { get; set; }

    /// <summary>Fail when fewer wires were measured than this: the statistics are too thin to judge.</summary>
    public int? MinWireCount { get; set; }

    /// <summary>
    /// Contact angle θ of the catalyst droplet on the wire top for this process (degrees, 90 &lt; θ &lt; 180), or null when
    /// unknown. Where a field shows only the droplet, the analysis takes the wire radius as r_drop·sin θ (a spherical cap
    /// with θ &gt; 90° shows its equator from above; DERIVED); without it such wires keep their droplet radius only and stay
    /// out of the radius statistics. Not a QC limit: a process property the measurement needs.
    /// </summary>
    public double? DropletContactAngleDeg { get; set; }

    /// <summary>Outcome of a configured rule whose measurement is missing.</summary>
    /// <value><see cref="QcOutcome.Warn"/></value>
    public QcOutcome MissingValueOutcome { get; set; } = QcOutcome.Warn;

    /// <summary>Checks the specification; returns one message per problem (empty when valid).</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (TargetMeanRadiusNm is { } target && !(target > 0))
        {
            errors.Add($"TargetMeanRadiusNm must be > 0 (got {target}).");
        }
        if ((TargetMeanRadiusNm is null) != (MeanRadiusToleranceNm is null))
        {
            errors.Add("TargetMeanRadiusNm and MeanRadiusToleranceNm must be set together.");
        }
        if (MeanRadiusWarnToleranceNm is not null && MeanRadiusToleranceNm is null)
        {
            errors.Add("MeanRadiusWarnToleranceNm needs MeanRadiusToleranceNm.");
        }
        UpperPair(errors, nameof(MeanRadiusToleranceNm), MeanRadiusToleranceNm, nameof(MeanRadiusWarnToleranceNm), MeanRadiusWarnToleranceNm, positive: true);
        UpperPair(errors, nameof(MaxRadiusCv), MaxRadiusCv, nameof(WarnRadiusCv), WarnRadiusCv, positive: true);
        UpperPair(errors, nameof(MaxAbsBiasNm), MaxAbsBiasNm, nameof(WarnAbsBiasNm), WarnAbsBiasNm, positive: true);
        UpperPair(errors, nameof(MaxExcursionCount), MaxExcursionCount, nameof(WarnExcursionCount), WarnExcursionCount, positive: false);
        UpperPair(errors, nameof(MaxAbsRelativeLChange), MaxAbsRelativeLChange, nameof(WarnAbsRelativeLChange), WarnAbsRelativeLChange, positive: true);
        LowerFractionPair(errors, nameof(MinVerticalYield), MinVerticalYield, nameof(WarnVerticalYield), WarnVerticalYield);
        LowerFractionPair(errors, nameof(MinThermalCoverage), MinThermalCoverage, nameof(WarnThermalCoverage), WarnThermalCoverage);
        if (MinDensityPerCm2 is { } dMin && !(dMin > 0))
        {
            errors.Add($"MinDensityPerCm2 must be > 0 (got {dMin}).");
        }
        if (MinDensityPerCm2 is { } lo && MaxDensityPerCm2 is { } hi && !(hi > lo))
        {
            errors.Add($"MaxDensityPerCm2 ({hi}) must exceed MinDensityPerCm2 ({lo}).");
        }
        if (WarnMinDensityPerCm2 is { } wlo && !(wlo >= (MinDensityPerCm2 ?? double.NaN)))
        {
            errors.Add("WarnMinDensityPerCm2 needs MinDensityPerCm2 and must be ≥ it.");
        }
        if (WarnMaxDensityPerCm2 is { } whi && !(whi <= (MaxDensityPerCm2 ?? double.NaN)))
        {
            errors.Add("WarnMaxDensityPerCm2 needs MaxDensityPerCm2 and must be ≤ it.");
        }
        if (WarnMinDensityPerCm2 is { } a && WarnMaxDensityPerCm2 is { } b && !(b > a))
        {
            errors.Add("The warn density window is empty (WarnMaxDensityPerCm2 ≤ WarnMinDensityPerCm2).");
        }
        if (DropletContactAngleDeg is { } theta && !(theta > MinDropletContactAngleDeg && theta < MaxDropletContactAngleDeg))
        {
            errors.Add($"DropletContactAngleDeg must lie between {MinDropletContactAngleDeg}° and {MaxDropletContactAngleDeg}° exclusive (a droplet wider than its facet; got {theta}).");
        }
        if (MinWireCount is < 1)
        {
            errors.Add($"MinWireCount must be ≥ 1 (got {MinWireCount}).");
        }
        if (!Enum.IsDefined(MissingValueOutcome))
        {
            errors.Add($"MissingValueOutcome '{MissingValueOutcome}' is not pass, warn or fail.");
        }
        return errors;
    }

    private static void UpperPair(List<string> errors, string failName, double? fail, string warnName, double? warn, bool positive)
    {
        if (fail is { } f && (positive ? !(f > 0) : !(f >= 0)))
        {
            errors.Add($"{failName} must be {(positive ? "> 0" : "≥ 0")} (got {f}).");
        }
        if (warn is { } w)
        {
            if (fail is null)
            {
                errors.Add($"{warnName} needs {failName}.");
            }
            else if (!(w >= 0) || w > fail)
            {
                errors.Add($"{warnName} ({w}) must lie in [0, {failName} = {fail}].");
            }
        }
    }

    private static void LowerFractionPair(List<string> errors, string failName, double? fail, string warnName, double? warn)
    {
        if (fail is { } f && !(f >= 0 && f <= 1))
        {
            errors.Add($"{failName} is a fraction in [0, 1] (got {f}).");
        }
        if (warn is { } w)
        {
            if (fail is null)
            {
                errors.Add($"{warnName} needs {failName}.");
            }
            else if (!(w >= fail && w <= 1))
            {
                errors.Add($"{warnName} ({w}) must lie in [{failName} = {fail}, 1].");
            }
        }
    }
}
