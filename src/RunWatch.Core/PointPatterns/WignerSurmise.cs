using MathNet.Numerics;
using MathNet.Numerics.Distributions;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Generalised Wigner surmise P_β(s) = a_β·s^β·exp(−b_β·s²) for normalised capture-zone areas s = A/⟨A⟩
/// (Pimpinelli &amp; Einstein 2007, "Capture-zone scaling in island nucleation: universal fluctuation behavior",
/// Phys. Rev. Lett. 99, 226102; Einstein, Pimpinelli &amp; González 2014, "Analyzing capture zone distributions (CZD)
/// in growth: theory and applications", J. Cryst. Growth 401, 67–71; both citations CONFIRMED in CHECKS.md §4).
/// a_β and b_β make P_β a density with unit mean: b_β = [Γ((β+2)/2) / Γ((β+1)/2)]², a_β = 2·b_β^((β+1)/2) / Γ((β+1)/2)
/// (DERIVED; CHECKS.md §4). Equivalently s² ~ Gamma(shape (β+1)/2, rate b_β). Valid for β &gt; −1. Thread-safe.
/// </summary>
public static class WignerSurmise
{
    /// <summary>a_β and b_β.</summary>
    public static (double A, double B) Coefficients(double beta)
    {
        CheckBeta(beta);
        double lnB = LnB(beta);
        double lnA = Math.Log(2.0) + (0.5 * (beta + 1.0) * lnB) - SpecialFunctions.GammaLn(0.5 * (beta + 1.0));
        return (Math.Exp(lnA), Math.Exp(lnB));
    }

    /// <summary>P_β(s); 0 for s &lt; 0.</summary>
    public static double Density(double s, double beta)
    {
        if (s > 0.0)
        {
            return Math.Exp(LogDensity(s, beta));
        }
        if (s < 0.0 || beta > 0.0)
        {
            return 0.0;
        }
        return beta == 0.0 ? Coefficients(beta).A : double.PositiveInfinity;
    }

    /// <summary>ln P_β(s) for s &gt; 0.</summary>
    public static double LogDensity(double s, double beta)
    {
        (double lnA, double b) = LogCoefficients(beta);
        return lnA + (beta * Math.Log(s)) - (b * s * s);
    }

    /// <summary>P(S ≤ s) = P((β+1)/2, b_β·s²), the regularised lower incomplete gamma function.</summary>
    public static double Cdf(double s, double beta)
    {
        CheckBeta(beta);
        return s <= 0.0 ? 0.0 : SpecialFunctions.GammaLowerRegularized(0.5 * (beta + 1.0), Math.Exp(LnB(beta)) * s * s);
    }

    /// <summary>Var(s) = (β+1)/(2·b_β) − 1 (from E[s²] = shape/rate; DERIVED).</summary>
    public static double Variance(double beta)
    {
        CheckBeta(beta);
        return ((beta + 1.0) / (2.0 * Math.Exp(LnB(beta)))) - 1.0;
    }

    /// <summary>Draws from P_β: s = √X with X ~ Gamma((β+1)/2, rate b_β) (MathNet.Numerics Gamma sampler).</summary>
    public static double Sample(Random random, double beta)
    {
        ArgumentNullException.ThrowIfNull(random);
        CheckBeta(beta);
        return Math.Sqrt(Gamma.Sample(random, 0.5 * (beta + 1.0), Math.Exp(LnB(beta))));
    }

    /// <summary>Fills <paramref name="destination"/> with draws from P_β.</summary>
    public static void Sample(Random random, double beta, Span<double> destination)
    {
        ArgumentNullException.ThrowIfNull(random);
        CheckBeta(beta);
        double shape = 0.5 * (beta + 1.0), rate = Math.Exp(LnB(beta));
        for (int i = 0; i < destination.Length; i++)
        {
            destination[i] = Math.Sqrt(Gamma.Sample(random, shape, rate));
        }
    }

    internal static (double LnA, double B) LogCoefficients(double beta)
    {
        CheckBeta(beta);
        double lnB = LnB(beta);
        double lnA = Math.Log(2.0) + (0.5 * (beta + 1.0) * lnB) - SpecialFunctions.GammaLn(0.5 * (beta + 1.0));
        return (lnA, Math.Exp(lnB));
    }

    private static double LnB(double beta) =>
        2.0 * (SpecialFunctions.GammaLn(0.5 * (beta + 2.0)) - SpecialFunctions.GammaLn(0.5 * (beta + 1.0)));

    private static void CheckBeta(double beta)
    {
        if (!(beta > -1.0) || !double.IsFinite(beta))
        {
            throw new ArgumentOutOfRangeException(nameof(beta), beta, "β must be a finite number > −1");
        }
    }
}
