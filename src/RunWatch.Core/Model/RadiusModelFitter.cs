using MathNet.Numerics.Distributions;

namespace RunWatch.Core.Model;

/// <summary>
/// Fits per-process radius models r(Â) by least squares: linear in closed form, power law by Levenberg–Marquardt on
/// the radius itself (not on its logarithm), started from the log-log line. Pure; thread-safe.
/// </summary>
/// <remarks>
/// Intervals: estimate ± t₀.₉₇₅,ₙ₋₂·SE, SE² = diag of s²·(JᵀJ)⁻¹, s² = SSR/(n − 2). For the power law this is the
/// usual linearised (asymptotic) interval (Bates &amp; Watts, Nonlinear Regression Analysis, 1988, §2.3).
/// Selection: both forms have two parameters, so AIC = n·ln(SSR/n) + 6, adjusted r², r² and SSR all rank them the
/// same way; AIC is the stated criterion and a tie keeps the linear form.
/// </remarks>
public static class RadiusModelFitter
{
    /// <summary>The selection criterion as written into fit records.</summary>
    public const string SelectionCriterion = "lowest AIC = n·ln(SSR/n) + 2·3 (equal parameter counts: same order as adjusted r²); tie → linear";

    /// <summary>Fits r = a + b·Â.</summary>
    /// <param name="normalisedAreas">Â per wire (dimensionless).</param>
    /// <param name="radiiNm">Measured radius per wire (nm).</param>
    /// <exception cref="ArgumentException">Fewer than 3 wires, lengths differ, non-finite values or all Â equal.</exception>
    public static RadiusModelFit FitLinear(ReadOnlySpan<double> normalisedAreas, ReadOnlySpan<double> radiiNm)
    {
        LineFit line = LeastSquares.FitLine(normalisedAreas, radiiNm);
        int n = line.Count;
        double t = TQuantile(n - 2);
        var parameters = new[]
        {
            Estimate("a", line.Intercept, line.InterceptStandardError, t, "nm"),
            Estimate("b", line.Slope, line.SlopeStandardError, t, "nm"),
        };
        return Build(RadiusModelKind.Linear, parameters, n, line.ResidualSumOfSquares, line.TotalSumOfSquares, 0);
    }

    /// <summary>Fits r = k·Â^p by nonlinear least squares on r.</summary>
    /// <exception cref="ArgumentException">Fewer than 3 wires, lengths differ, or a non-positive Â or radius.</exception>
    /// <exception cref="InvalidOperationException">The solver met a singular Jacobian.</exception>
    public static RadiusModelFit FitPowerLaw(ReadOnlySpan<double> normalisedAreas, ReadOnlySpan<double> radiiNm, PowerLawFitOptions? options = null)
    {
        options ??= PowerLawFitOptions.Default;
        options.Validate();
        int n = normalisedAreas.Length;
        if (radiiNm.Length != n)
        {
            throw new ArgumentException($"Â has {n} values but r has {radiiNm.Length}.", nameof(radiiNm));
        }
        var logX = new double[n];
        var logY = new double[n];
        for (int i = 0; i < n; i++)
        {
            if (!(normalisedAreas[i] > 0) || !(radiiNm[i] > 0) || !double.IsFinite(normalisedAreas[i]) || !double.IsFinite(radiiNm[i]))
            {
                throw new ArgumentException($"The power law needs positive finite Â and r; wire {i} has Â = {normalisedAreas[i]}, r = {radiiNm[i]}.", nameof(normalisedAreas));
            }
            logX[i] = Math.Log(normalisedAreas[i]);
            logY[i] = Math.Log(radiiNm[i]);
        }
        LineFit start = LeastSquares.FitLine(logX, logY);
        double k = Math.Exp(start.Intercept);
        double p = start.Slope;

        var a = new double[(n + 2) * 2];
        var b = new double[n + 2];
        var aWork = new double[(n + 2) * 2];
        var bWork = new double[n + 2];
        Span<double> step = stackalloc double[2];
        Span<double> rFactor = stackalloc double[4];
        double ssr = PowerSsr(normalisedAreas, radiiNm, k, p);
        double lambda = 1e-3;
        int iterations = 0;
        while (iterations < options.MaxIterations)
        {
            iterations++;
            double d0 = 0;
            double d1 = 0;
            for (int i = 0; i < n; i++)
            {
                double xp = Math.Pow(normalisedAreas[i], p);
                double j0 = xp;
                double j1 = k * xp * logX[i];
                a[i * 2] = j0;
                a[(i * 2) + 1] = j1;
                b[i] = radiiNm[i] - (k * xp);
                d0 += j0 * j0;
                d1 += j1 * j1;
            }
            bool improved = false;
            bool converged = false;
            // Raise the damping until a step lowers SSR (Marquardt scaling by diag(JᵀJ)).
            for (int attempt = 0; attempt < 60; attempt++)
            {
                a.AsSpan(0, n * 2).CopyTo(aWork);
                b.AsSpan(0, n).CopyTo(bWork);
                aWork[n * 2] = Math.Sqrt(lambda * d0);
                aWork[(n * 2) + 1] = 0;
                aWork[(n + 1) * 2] = 0;
                aWork[((n + 1) * 2) + 1] = Math.Sqrt(lambda * d1);
                bWork[n] = 0;
                bWork[n + 1] = 0;
                if (!LeastSquares.SolveQr(aWork, n + 2, 2, bWork, step, rFactor))
                {
                    throw new InvalidOperationException("The power-law Jacobian is singular (all Â equal?).");
                }
                double kNew = k + step[0];
                double pNew = p + step[1];
                double ssrNew = PowerSsr(normalisedAreas, radiiNm, kNew, pNew);
                if (ssrNew <= ssr)
                {
                    converged = Math.Abs(step[0]) <= options.RelativeStepTolerance * Math.Abs(k)
                        && Math.Abs(step[1]) <= options.RelativeStepTolerance * Math.Max(Math.Abs(p), 1e-3);
                    k = kNew;
                    p = pNew;
                    ssr = ssrNew;
                    lambda = Math.Max(lambda / 10, 1e-12);
                    improved = true;
                    break;
                }
                lambda *= 10;
            }
            if (!improved || converged)
            {
                break;
            }
        }

        for (int i = 0; i < n; i++)
        {
            double xp = Math.Pow(normalisedAreas[i], p);
            a[i * 2] = xp;
            a[(i * 2) + 1] = k * xp * logX[i];
            b[i] = 0;
        }
        Span<double> unused = stackalloc double[2];
        if (!LeastSquares.SolveQr(a.AsSpan(0, n * 2), n, 2, b.AsSpan(0, n), unused, rFactor))
        {
            throw new InvalidOperationException("The power-law Jacobian is singular at the solution.");
        }
        double[] gramInverse = LeastSquares.InverseGram(rFactor, 2);
        double s2 = ssr / (n - 2);
        double t = TQuantile(n - 2);
        var parameters = new[]
        {
            Estimate("k", k, Math.Sqrt(s2 * gramInverse[0]), t, "nm"),
            Estimate("p", p, Math.Sqrt(s2 * gramInverse[3]), t, ""),
        };
        double sst = 0;
        double mean = 0;
        for (int i = 0; i < n; i++)
        {
            mean += radiiNm[i];
        }
        mean /= n;
        for (int i = 0; i < n; i++)
        {
            sst += (radiiNm[i] - mean) * (radiiNm[i] - mean);
        }
        return Build(RadiusModelKind.PowerLaw, parameters, n, ssr, sst, iterations);
    }

    /// <summary>Fits one form.</summary>
    public static RadiusModelFit Fit(RadiusModelKind kind, ReadOnlySpan<double> normalisedAreas, ReadOnlySpan<double> radiiNm) =>
        kind == RadiusModelKind.Linear ? FitLinear(normalisedAreas, radiiNm) : FitPowerLaw(normalisedAreas, radiiNm);

    /// <summary>Fits both forms and selects one by <see cref="SelectionCriterion"/>.</summary>
    public static RadiusModelComparison FitAndSelect(ReadOnlySpan<double> normalisedAreas, ReadOnlySpan<double> radiiNm)
    {
        RadiusModelFit linear = FitLinear(normalisedAreas, radiiNm);
        RadiusModelFit power = FitPowerLaw(normalisedAreas, radiiNm);
        RadiusModelKind selected = power.Aic < linear.Aic ? RadiusModelKind.PowerLaw : RadiusModelKind.Linear;
        return new RadiusModelComparison(linear, power, selected, SelectionCriterion);
    }

    internal static double TQuantile(int degreesOfFreedom) => StudentT.InvCDF(0, 1, degreesOfFreedom, 0.975);

    private static ParameterEstimate Estimate(string name, double value, double se, double t, string unit) =>
        new(name, value, se, value - (t * se), value + (t * se), unit);

    private static RadiusModelFit Build(RadiusModelKind kind, ParameterEstimate[] parameters, int n, double ssr, double sst, int iterations)
    {
        double r2 = sst > 0 ? 1 - (ssr / sst) : double.NaN;
        double adjusted = 1 - ((1 - r2) * (n - 1) / (n - 2));
        double rmse = Math.Sqrt(ssr / n);
        double s = Math.Sqrt(ssr / (n - 2));
        // A perfect fit has SSR = 0 and AIC = −∞; floor SSR so records stay finite and serialisable.
        double aic = (n * Math.Log(Math.Max(ssr, double.Epsilon) / n)) + (2 * 3);
        return new RadiusModelFit(kind, parameters, n, r2, adjusted, rmse, s, aic, iterations);
    }

    private static double PowerSsr(ReadOnlySpan<double> x, ReadOnlySpan<double> y, double k, double p)
    {
        double sum = 0;
        for (int i = 0; i < x.Length; i++)
        {
            double r = y[i] - (k * Math.Pow(x[i], p));
            sum += r * r;
        }
        return double.IsFinite(sum) ? sum : double.PositiveInfinity;
    }
}
