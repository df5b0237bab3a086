using RunWatch.Reports.Model;

namespace RunWatch.Reports.Json;

/// <summary>The thermal figures of a report summary.</summary>
public sealed record ThermalFigures(
    double? SetpointC,
    double GrowthWindowStartS,
    double GrowthWindowEndS,
    double NominalLengthNm,
    double EffectiveLengthNm,
    double EffectiveTemperatureC,
    double ConventionFactor,
    double CoverageFraction,
    string GapPolicy,
    int SampleCount,
    IReadOnlyList<ExcursionRow> Excursions);
