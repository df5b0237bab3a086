namespace RunWatch.Web.Data;

/// <summary>
/// One run's figures for the trend charts: wafer figures are the mean over the run's reported wafers (mean radius,
/// radius CV, density in µm⁻², prediction bias = predicted − measured); λ_eff and T_eff are the run's own. NaN when unknown.
/// </summary>
public sealed record RunTrendPoint(string RunId, string Chamber, string Process, DateTimeOffset Start, string? Verdict,
    double MeanRadiusNm, double RadiusCv, double DensityPerUm2, double LEffNm, double BiasNm, double TEffC, int Excursions);
