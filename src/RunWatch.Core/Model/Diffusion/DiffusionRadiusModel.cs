using System.Text.Json.Serialization;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// The radius model: at fixed wire height a wire's volume grows with what it collects, so
/// r_i² = r₀² + κ·∫ A_i(λ(T(t))) dt over the growth window, A_i from the diffusion solution on the measured field and
/// λ(T) from <see cref="CaptureLengthLaw"/>. κ folds flux, atomic volume and height per process (nm² per µm²·s).
/// </summary>
/// <param name="Lambda0SquaredUm2">λ₀² (µm²).</param>
/// <param name="ActivationEv">E_λ (eV).</param>
/// <param name="KappaNm2PerUm2S">κ (nm² of radius² per µm² of capture area per second).</param>
/// <param name="R0SquaredNm2">r₀² (nm²); r₀ is the radius a wire would have with no collection (may be fitted as 0).</param>
/// <param name="ReferenceTemperatureK">Mean growth temperature of the calibration wafers, where λ is best located.</param>
/// <param name="Parameters">Estimates with profile-likelihood intervals: λ_ref, λ₀², E_λ, κ, r₀ (empty for a hand-made model).</param>
/// <param name="CalibratedMinC">Lowest mean growth temperature among the calibration wafers (°C, true).</param>
/// <param name="CalibratedMaxC">Highest.</param>
/// <param name="CalibratedMinS">Shortest growth window among the calibration wafers (s).</param>
/// <param name="CalibratedMaxS">Longest.</param>
/// <param name="ResidualSdNm">Residual standard deviation of the fit (nm).</param>
public sealed record DiffusionRadiusModel(
    double Lambda0SquaredUm2,
    double ActivationEv,
    double KappaNm2PerUm2S,
    double R0SquaredNm2,
    double ReferenceTemperatureK,
    IReadOnlyList<ParameterEstimate> Parameters,
    double CalibratedMinC,
    double CalibratedMaxC,
    double CalibratedMinS,
    double CalibratedMaxS,
    double ResidualSdNm)
{
    /// <summary>λ(T) of this model.</summary>
    [JsonIgnore]
    public CaptureLengthLaw Law => new(Lambda0SquaredUm2, ActivationEv);

    /// <summary>λ at a true temperature in °C (µm).</summary>
    public double LambdaAtUm(double temperatureC) => Law.LambdaUm(PhysicalConstants.CelsiusToKelvin(temperatureC));

    /// <summary>Radius (nm) of a wire that collected <paramref name="integralUm2S"/> = ∫A dt.</summary>
    public double RadiusNm(double integralUm2S) => Math.Sqrt(Math.Max(R0SquaredNm2 + (KappaNm2PerUm2S * integralUm2S), 0));

    /// <summary>
    /// Each wire's ∫A dt (µm²·s) and predicted radius (nm) for a field's table over an exposure. Returns the seconds
    /// whose λ fell outside the table (clamped; a caller should widen the table when this is not 0).
    /// </summary>
    public double Predict(CaptureAreaTable table, ThermalExposure exposure, Span<double> integralsUm2S, Span<double> radiiNm)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(exposure);
        var weights = new double[table.FineCount];
        double outside = exposure.Weights(Law, table, weights);
        table.Collect(weights, integralsUm2S);
        for (int i = 0; i < table.WireCount; i++)
        {
            radiiNm[i] = RadiusNm(integralsUm2S[i]);
        }
        return outside;
    }

    /// <summary>True when a temperature (°C) and window length (s) lie inside the calibrated ranges (5 K and 10 % slack).</summary>
    public bool Covers(double temperatureC, double windowS) =>
        temperatureC >= CalibratedMinC - 5 && temperatureC <= CalibratedMaxC + 5
        && windowS >= CalibratedMinS * 0.9 && windowS <= CalibratedMaxS * 1.1;
}
