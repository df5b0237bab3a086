namespace RunWatch.Core.Thermal;

/// <summary>
/// Adatom lifetime before desorption, τ(T) = τ0·exp(E_d/(kB·T)), for the lifetime-limited diffusion length
/// λ = sqrt(c·D·τ). With D Arrhenius, D·τ is Arrhenius too: prefactor D0·τ0, activation Ea − E_d.
/// </summary>
/// <param name="Tau0S">Pre-exponential lifetime τ0 in s (positive).</param>
/// <param name="EdEv">Desorption energy E_d in eV (non-negative).</param>
public readonly record struct LifetimeModel(double Tau0S, double EdEv)
{
    /// <summary>τ at <paramref name="temperatureK"/> in s.</summary>
    public double LifetimeS(double temperatureK) => Tau0S * Math.Exp(EdEv / (PhysicalConstants.BoltzmannEvPerK * temperatureK));

    /// <summary>The Arrhenius form of D·τ in cm² (its "D0" is D0·τ0 in cm², its "Ea" is Ea − E_d in eV, which may be negative).</summary>
    public ArrheniusDiffusivity ProductWith(ArrheniusDiffusivity diffusivity) =>
        new(diffusivity.D0CmSqPerS * Tau0S, diffusivity.EaEv - EdEv);

    /// <summary>Returns the problems with the parameters; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (!(Tau0S > 0) || !double.IsFinite(Tau0S))
        {
            errors.Add($"τ0 must be a positive finite number of seconds (got {Tau0S}).");
        }
        if (!(EdEv >= 0) || !double.IsFinite(EdEv))
        {
            errors.Add($"E_d must be a non-negative finite number of eV (got {EdEv}).");
        }
        return errors;
    }
}
