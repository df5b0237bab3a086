namespace RunWatch.Web.Data;

/// <summary>A stored diffusion radius model of a process (accepted or proposed), as the Process model screen shows it.</summary>
/// <param name="RecordId">Model record id.</param>
/// <param name="FittedAt">When it was fitted.</param>
/// <param name="Parameters">λ at the reference temperature, λ₀², E_λ, κ, r₀ with their intervals.</param>
/// <param name="ReferenceTemperatureC">Mean growth temperature of the calibration wafers.</param>
/// <param name="LambdaAtReferenceNm">λ there, nm.</param>
/// <param name="CalibratedMinC">Calibrated temperature range, lowest.</param>
/// <param name="CalibratedMaxC">Highest.</param>
/// <param name="CalibratedMinS">Calibrated growth-time range, shortest (s).</param>
/// <param name="CalibratedMaxS">Longest.</param>
/// <param name="ResidualSdNm">Residual SD of the fit.</param>
/// <param name="Wafers">Wafers the fit used.</param>
/// <param name="WireDensityPerUm2">Process wire density used for run-end estimates.</param>
public sealed record DiffusionModelFit(long RecordId, DateTimeOffset FittedAt, IReadOnlyList<DiffusionParameterRow> Parameters, double ReferenceTemperatureC,
    double LambdaAtReferenceNm, double CalibratedMinC, double CalibratedMaxC, double CalibratedMinS, double CalibratedMaxS, double ResidualSdNm,
    IReadOnlyList<string> Wafers, double WireDensityPerUm2);
