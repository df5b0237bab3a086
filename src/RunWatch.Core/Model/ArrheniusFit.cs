namespace RunWatch.Core.Model;

/// <summary>
/// Ea and D0 of D(T) = D0·exp(−Ea/(kB·T)) fitted across wafers: ln(L²/(c·t)) = ln D0 − (Ea/kB)·(1/T_eff).
/// </summary>
/// <param name="ActivationEnergy">Ea (eV) = −slope·kB, with interval from the slope's.</param>
/// <param name="Prefactor">D0 (cm²/s) = exp(intercept); SE by the delta method (D0·SE(ln D0)), interval = exp of the intercept's interval (asymmetric).</param>
/// <param name="LnPrefactor">ln(D0 / (cm²/s)) with its symmetric interval.</param>
/// <param name="Count">Wafers used.</param>
/// <param name="RSquared">r² of the straight line in (1/T, ln D).</param>
/// <param name="ResidualStandardError">s of ln D about the line.</param>
/// <param name="WaferIds">The wafers used, in input order.</param>
public sealed record ArrheniusFit(
    ParameterEstimate ActivationEnergy,
    ParameterEstimate Prefactor,
    ParameterEstimate LnPrefactor,
    int Count,
    double RSquared,
    double ResidualStandardError,
    IReadOnlyList<string> WaferIds)
{
    /// <summary>The fitted parameters in the thermal physics' form, for L_eff once a person has accepted them.</summary>
    public Thermal.ArrheniusDiffusivity ToDiffusivity() => new(Prefactor.Value, ActivationEnergy.Value);

    /// <summary>D(T) in cm²/s from the fitted parameters.</summary>
    public double Diffusivity(double temperatureK) =>
        Prefactor.Value * Math.Exp(-ActivationEnergy.Value / (ArrheniusCalibration.BoltzmannEvPerK * temperatureK));
}
