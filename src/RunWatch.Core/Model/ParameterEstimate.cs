namespace RunWatch.Core.Model;

/// <summary>One fitted parameter with its standard error and two-sided 95 % confidence interval.</summary>
/// <param name="Name">Parameter name as used in the model formula (a, b, k, p, Ea, D0...).</param>
/// <param name="Value">Estimate.</param>
/// <param name="StandardError">Standard error (from the covariance s²·(JᵀJ)⁻¹; asymptotic for nonlinear fits).</param>
/// <param name="Lower95">Lower end of the 95 % interval (estimate − t₀.₉₇₅,ν·SE unless stated otherwise).</param>
/// <param name="Upper95">Upper end of the 95 % interval.</param>
/// <param name="Unit">Unit of the value, for reports ("nm", "eV", "cm²/s", "" for dimensionless).</param>
public sealed record ParameterEstimate(string Name, double Value, double StandardError, double Lower95, double Upper95, string Unit)
{
    /// <summary>True when <paramref name="value"/> lies in the closed 95 % interval.</summary>
    public bool IntervalContains(double value) => value >= Lower95 && value <= Upper95;
}
