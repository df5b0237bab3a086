namespace RunWatch.Core.Thermal;

/// <summary>
/// Exponential integrals E_n(x) = ∫₁^∞ e^{−x·t}/tⁿ dt for n = 1, 2 and x &gt; 0 (A&amp;S 5.1.4; E1 is A&amp;S 5.1.1, DLMF 6.2.1).
/// .NET has none. The scaled forms eˣ·E_n(x) stay finite for large x, which the ramp closed form needs.
/// Method: power series for x ≤ 1 (A&amp;S 5.1.11), modified Lentz continued fraction for x &gt; 1 (A&amp;S 5.1.22;
/// Press et al., Numerical Recipes, 3rd ed., §6.3). Relative accuracy about 1e-15.
/// </summary>
public static class ExponentialIntegral
{
    private const double EulerGamma = 0.57721566490153286061;
    private const double Epsilon = 1e-16;
    private const int MaxIterations = 500;

    /// <summary>E1(x) for x &gt; 0 (+∞ at 0).</summary>
    public static double E1(double x) => x > 1 ? Math.Exp(-x) * ScaledContinuedFraction(1, x) : SeriesE1(x);

    /// <summary>E2(x) for x ≥ 0 (E2(0) = 1).</summary>
    public static double E2(double x) => x > 1 ? Math.Exp(-x) * ScaledContinuedFraction(2, x) : x == 0 ? 1 : Math.Exp(-x) - x * SeriesE1(x);

    /// <summary>eˣ·E1(x) for x &gt; 0.</summary>
    public static double ScaledE1(double x) => x > 1 ? ScaledContinuedFraction(1, x) : Math.Exp(x) * SeriesE1(x);

    /// <summary>eˣ·E2(x) for x ≥ 0; tends to 1/x for large x.</summary>
    public static double ScaledE2(double x) => x > 1 ? ScaledContinuedFraction(2, x) : x == 0 ? 1 : 1 - x * Math.Exp(x) * SeriesE1(x);

    private static double SeriesE1(double x)
    {
        if (!(x > 0))
        {
            return x == 0 ? double.PositiveInfinity : double.NaN;
        }
        // E1(x) = −γ − ln x − Σ_{k≥1} (−x)^k / (k·k!)
        double sum = 0;
        double term = 1;
        for (int k = 1; k < MaxIterations; k++)
        {
            term *= -x / k;
            double add = term / k;
            sum += add;
            if (Math.Abs(add) < Epsilon * Math.Abs(sum))
            {
                break;
            }
        }
        return -EulerGamma - Math.Log(x) - sum;
    }

    // eˣ·E_n(x) = 1/(x+n− 1·n/(x+n+2− 2(n+1)/(x+n+4− …))), evaluated by the modified Lentz method.
    private static double ScaledContinuedFraction(int n, double x)
    {
        if (double.IsPositiveInfinity(x))
        {
            return 0;
        }
        const double tiny = 1e-300;
        double b = x + n;
        double c = 1 / tiny;
        double d = 1 / b;
        double h = d;
        for (int i = 1; i < MaxIterations; i++)
        {
            double a = -i * (double)(n - 1 + i);
            b += 2;
            d = 1 / (a * d + b);
            c = b + a / c;
            double delta = c * d;
            h *= delta;
            if (Math.Abs(delta - 1) < Epsilon)
            {
                return h;
            }
        }
        return h;
    }
}
