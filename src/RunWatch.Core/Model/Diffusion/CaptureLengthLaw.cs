using RunWatch.Core.Thermal;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// Capture length against temperature: λ(T)² = λ₀²·exp(−E_λ/(k_B·T)), with λ² = D·τ, D = D₀·exp(−E_D/kT) and
/// τ = τ₀·exp(E_des/kT), so E_λ = E_D − E_des (either sign) and λ₀² = D₀·τ₀ (DERIVED from the two Arrhenius laws).
/// </summary>
/// <param name="Lambda0SquaredUm2">λ₀² in µm².</param>
/// <param name="ActivationEv">E_λ in eV.</param>
public sealed record CaptureLengthLaw(double Lambda0SquaredUm2, double ActivationEv)
{
    /// <summary>λ at <paramref name="temperatureK"/>, in µm.</summary>
    public double LambdaUm(double temperatureK) =>
        Math.Sqrt(Lambda0SquaredUm2 * Math.Exp(-ActivationEv / (PhysicalConstants.BoltzmannEvPerK * temperatureK)));

    /// <summary>The law through λ = <paramref name="lambdaUm"/> at <paramref name="temperatureK"/> with activation <paramref name="activationEv"/>.</summary>
    public static CaptureLengthLaw Through(double lambdaUm, double temperatureK, double activationEv) =>
        new(lambdaUm * lambdaUm * Math.Exp(activationEv / (PhysicalConstants.BoltzmannEvPerK * temperatureK)), activationEv);
}
