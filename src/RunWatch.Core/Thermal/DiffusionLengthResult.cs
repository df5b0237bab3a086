namespace RunWatch.Core.Thermal;

/// <summary>
/// Diffusion length of one growth window computed from the thermal record. Lengths are in µm and always go with
/// <see cref="ConventionFactor"/>: show it beside every length.
/// </summary>
public sealed record DiffusionLengthResult
{
    /// <summary>The convention factor c used for every length here.</summary>
    public required double ConventionFactor { get; init; }

    /// <summary>The process parameters used.</summary>
    public required ArrheniusDiffusivity Diffusivity { get; init; }

    /// <summary>The window analysed.</summary>
    public required GrowthWindow Window { get; init; }

    /// <summary>∫D dt over the covered part of the window, cm².</summary>
    public required double IntegralCmSq { get; init; }

    /// <summary>Time covered by the record inside the window, s.</summary>
    public required double CoveredS { get; init; }

    /// <summary>Covered fraction of the window, %.</summary>
    public required double CoveragePercent { get; init; }

    /// <summary>Uncovered intervals longer than the gap limit.</summary>
    public required IReadOnlyList<RecordGap> Gaps { get; init; }

    /// <summary>The gap limit used, s.</summary>
    public required double MaxGapS { get; init; }

    /// <summary>False when a gap exceeds the limit: the lengths cover only the recorded part of the window.</summary>
    public bool IsComplete => Gaps.Count == 0;

    /// <summary>L_eff = sqrt(c·∫D dt) over the covered time, µm.</summary>
    public required double EffectiveLengthUm { get; init; }

    /// <summary>T_eff in °C: the constant temperature giving the same ∫D dt over the covered time (NaN if undefined).</summary>
    public required double EffectiveTemperatureC { get; init; }

    /// <summary>d(ln L)/dT at T_eff, 1/K (NaN if T_eff is undefined).</summary>
    public required double LogSensitivityPerK { get; init; }

    /// <summary>L_nom = sqrt(c·D(T_set)·t_planned), µm, when a plan was given.</summary>
    public double? NominalLengthUm { get; init; }

    /// <summary>The plan used for <see cref="NominalLengthUm"/>.</summary>
    public GrowthPlan? Plan { get; init; }

    /// <summary>
    /// Lifetime-limited length λ_eff = sqrt(c·⟨D·τ⟩) with ⟨·⟩ the time average over the covered time, µm, when a
    /// lifetime model was given.
    /// </summary>
    public double? LifetimeLimitedLengthUm { get; init; }
}
