namespace RunWatch.Reports.Model;

/// <summary>The run's thermal history and the diffusion length computed from it.</summary>
/// <param name="TimesS">Sample times, seconds after run start (ascending).</param>
/// <param name="TemperaturesC">True substrate temperature per sample (°C), same length as <paramref name="TimesS"/>.</param>
/// <param name="SetpointC">Recipe setpoint during growth (°C), or null.</param>
/// <param name="GrowthWindowStartS">Growth window start (s after run start).</param>
/// <param name="GrowthWindowEndS">Growth window end (s after run start).</param>
/// <param name="Excursions">Excursions detected in the record.</param>
/// <param name="NominalLengthNm">L_nom = √(c·D(T_set)·t_planned) (nm).</param>
/// <param name="EffectiveLengthNm">L_eff = √(c·∫_W D(T(t)) dt) (nm).</param>
/// <param name="EffectiveTemperatureC">T_eff (°C).</param>
/// <param name="ConventionFactor">c (1 for L = √(D·t), 4 for the 2-D mean-square displacement).</param>
/// <param name="CoverageFraction">Share of the growth window covered by the record (0..1).</param>
/// <param name="GapPolicy">How gaps were handled, in words.</param>
public sealed record ThermalSummary(
    IReadOnlyList<double> TimesS,
    IReadOnlyList<double> TemperaturesC,
    double? SetpointC,
    double GrowthWindowStartS,
    double GrowthWindowEndS,
    IReadOnlyList<ExcursionRow> Excursions,
    double NominalLengthNm,
    double EffectiveLengthNm,
    double EffectiveTemperatureC,
    double ConventionFactor,
    double CoverageFraction,
    string GapPolicy);
