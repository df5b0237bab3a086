namespace RunWatch.Core.Model;

/// <summary>
/// A fitted radius model r(Â) with its goodness of fit. Serialisable with System.Text.Json.
/// </summary>
/// <param name="Kind">Model form.</param>
/// <param name="Parameters">For <see cref="RadiusModelKind.Linear"/>: a (nm), b (nm); for <see cref="RadiusModelKind.PowerLaw"/>: k (nm), p.</param>
/// <param name="Count">Number of wires used.</param>
/// <param name="RSquared">1 − SSR/SST, SST about the mean radius.</param>
/// <param name="AdjustedRSquared">1 − (1 − r²)·(n − 1)/(n − 2).</param>
/// <param name="RmseNm">√(SSR/n).</param>
/// <param name="ResidualStandardErrorNm">s = √(SSR/(n − 2)), the estimate of the noise SD used for the intervals.</param>
/// <param name="Aic">n·ln(SSR/n) + 2·(2 + 1) (Gaussian errors, two model parameters plus the variance).</param>
/// <param name="Iterations">Iterations of the nonlinear solver (0 for the closed-form linear fit).</param>
public sealed record RadiusModelFit(
    RadiusModelKind Kind,
    IReadOnlyList<ParameterEstimate> Parameters,
    int Count,
    double RSquared,
    double AdjustedRSquared,
    double RmseNm,
    double ResidualStandardErrorNm,
    double Aic,
    int Iterations)
{
    /// <summary>Predicted radius (nm) for a normalised capture area.</summary>
    public double Predict(double normalisedArea) => Evaluate(Kind, Parameters[0].Value, Parameters[1].Value, normalisedArea);

    /// <summary>The model formula as text, with the fitted values, for reports.</summary>
    public string Formula(IFormatProvider? provider = null)
    {
        provider ??= System.Globalization.CultureInfo.InvariantCulture;
        return Kind == RadiusModelKind.Linear
            ? string.Format(provider, "r = {0:0.###} + {1:0.###}·Â nm", Parameters[0].Value, Parameters[1].Value)
            : string.Format(provider, "r = {0:0.###}·Â^{1:0.####} nm", Parameters[0].Value, Parameters[1].Value);
    }

    internal static double Evaluate(RadiusModelKind kind, double first, double second, double normalisedArea) =>
        kind == RadiusModelKind.Linear ? first + (second * normalisedArea) : first * Math.Pow(normalisedArea, second);
}
