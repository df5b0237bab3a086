namespace RunWatch.Core.Qc;

/// <summary>
/// The measured facts of one wafer that the QC rules judge. Null means "not measured": the rule then reports the
/// spec's <see cref="QcSpecification.MissingValueOutcome"/> instead of silently passing.
/// </summary>
/// <param name="WaferId">Wafer identity (shown in reasons).</param>
/// <param name="Recipe">Recipe name the spec is looked up by.</param>
/// <param name="WireCount">Wires measured over all fields.</param>
/// <param name="MeanRadiusNm">Mean measured wire radius (nm).</param>
/// <param name="RadiusCv">Coefficient of variation of the radius (SD / mean, a fraction).</param>
/// <param name="DensityPerCm2">Wire density (cm⁻²).</param>
/// <param name="VerticalYield">Fraction of wires that are vertical (0..1).</param>
/// <param name="PredictionBiasNm">Mean predicted − measured radius (nm), from the after-SEM comparison.</param>
/// <param name="ExcursionCount">Temperature excursions inside the growth window.</param>
/// <param name="MaxAbsRelativeLChange">Largest |ΔL/L| attributed to one excursion (fraction).</param>
/// <param name="ThermalCoverage">Fraction of the growth window covered by the thermal record (0..1).</param>
public sealed record WaferQcInput(
    string WaferId,
    string Recipe,
    int? WireCount,
    double? MeanRadiusNm,
    double? RadiusCv,
    double? DensityPerCm2,
    double? VerticalYield,
    double? PredictionBiasNm,
    int? ExcursionCount,
    double? MaxAbsRelativeLChange,
    double? ThermalCoverage);
