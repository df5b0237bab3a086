namespace RunWatch.Core.Thermal;

/// <summary>
/// Diffusion-length formulas. L = sqrt(c·∫D dt), with c the convention factor (1 for L = sqrt(D·t), 2 or 4 for
/// the 1-D or 2-D mean-square displacement; COMMON PRACTICE, no single source). Lengths in µm, D in cm²/s.
/// </summary>
public static class DiffusionLength
{
    /// <summary>Micrometres per centimetre.</summary>
    public const double UmPerCm = 1e4;

    /// <summary>L in µm from ∫D dt in cm²: sqrt(c·∫D dt).</summary>
    public static double LengthUm(double integralCmSq, double conventionFactor) =>
        Math.Sqrt(conventionFactor * integralCmSq) * UmPerCm;

    /// <summary>L_nom in µm: sqrt(c·D(T_set)·t_planned).</summary>
    public static double NominalLengthUm(ArrheniusDiffusivity diffusivity, double setpointC, double plannedS, double conventionFactor) =>
        LengthUm(diffusivity.DiffusivityCmSqPerS(PhysicalConstants.CelsiusToKelvin(setpointC)) * plannedS, conventionFactor);

    /// <summary>
    /// T_eff in K: the constant temperature that gives the same ∫D dt over <paramref name="durationS"/>,
    /// i.e. D(T_eff) = ∫D dt / duration, Arrhenius inverted. NaN when undefined (no duration, no integral or Ea = 0).
    /// </summary>
    public static double EffectiveTemperatureK(ArrheniusDiffusivity diffusivity, double integralCmSq, double durationS)
    {
        if (!(durationS > 0) || !(integralCmSq > 0) || !(diffusivity.EaEv > 0))
        {
            return double.NaN;
        }
        double meanD = integralCmSq / durationS;
        return diffusivity.ActivationTemperatureK / Math.Log(diffusivity.D0CmSqPerS / meanD);
    }

    /// <summary>d(ln L)/dT = Ea/(2·kB·T²) in 1/K (L ∝ sqrt(D), D Arrhenius; DERIVED).</summary>
    public static double LogSensitivityPerK(double eaEv, double temperatureK) =>
        eaEv / (2 * PhysicalConstants.BoltzmannEvPerK * temperatureK * temperatureK);

    /// <summary>
    /// The change of L in µm caused by an extra <paramref name="excessIntegralCmSq"/> of ∫D dt inside a total of
    /// <paramref name="totalIntegralCmSq"/>: L(total) − L(total − excess). Positive when the excess lengthened L.
    /// </summary>
    public static double LengthChangeUm(double totalIntegralCmSq, double excessIntegralCmSq, double conventionFactor) =>
        LengthUm(totalIntegralCmSq, conventionFactor) - LengthUm(Math.Max(0, totalIntegralCmSq - excessIntegralCmSq), conventionFactor);
}
