using MathNet.Numerics;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.RootFinding;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Fits β of the generalised Wigner surmise to zone areas: areas are normalised by their mean (s = A/⟨A⟩), β
/// maximises the (optionally window-truncated) likelihood, and the interval is where the log-likelihood stays within
/// χ²₁(level)/2 of its maximum (profile likelihood; COMMON PRACTICE). The moment estimate is reported beside it.
/// </summary>
public static class WignerSurmiseFit
{
    private const double ScanStep = 0.25;

    /// <summary>Fits areas (any positive unit; only their ratios to the mean matter). Needs at least 10 areas in the window.</summary>
    /// <exception cref="ArgumentException">Too few areas, a non-positive or non-finite area, or a bad option.</exception>
    public static WignerFitResult Fit(ReadOnlySpan<double> areas, WignerFitOptions? options = null)
    {
        options ??= new WignerFitOptions();
        options.Validate();
        double mean = 0.0;
        for (int i = 0; i < areas.Length; i++)
        {
            if (!double.IsFinite(areas[i]) || areas[i] <= 0.0)
            {
                throw new ArgumentException($"area {i} is {areas[i]}; areas must be finite and > 0", nameof(areas));
            }
            mean += areas[i];
        }
        mean /= Math.Max(1, areas.Length);

        var s = new double[areas.Length];
        double sumSq = 0.0;
        for (int i = 0; i < areas.Length; i++)
        {
            s[i] = areas[i] / mean;
            sumSq += (s[i] - 1.0) * (s[i] - 1.0);
        }
        double variance = areas.Length > 1 ? sumSq / (areas.Length - 1) : double.NaN;

        var window = new List<double>(s.Length);
        foreach (double v in s)
        {
            if (v >= options.MinS && v <= options.MaxS)
            {
                window.Add(v);
            }
        }
        if (window.Count < 10)
        {
            throw new ArgumentException($"only {window.Count} normalised areas lie in [{options.MinS}, {options.MaxS}]; the fit needs at least 10");
        }
        var sufficient = new Sufficient(window, options.MinS, options.MaxS);

        double beta = Maximise(sufficient, options.MinBeta, options.MaxBeta);
        double peak = sufficient.LogLikelihood(beta);
        double drop = 0.5 * ChiSquared.InvCDF(1.0, options.ConfidenceLevel);
        double Excess(double b) => peak - sufficient.LogLikelihood(b) - drop;
        double lower = Excess(options.MinBeta) > 0.0 ? Brent.FindRoot(Excess, options.MinBeta, beta, 1e-8, 200) : options.MinBeta;
        double upper = Excess(options.MaxBeta) > 0.0 ? Brent.FindRoot(Excess, beta, options.MaxBeta, 1e-8, 200) : options.MaxBeta;
        double span = options.MaxBeta - options.MinBeta;
        bool atBound = beta - options.MinBeta < 1e-6 * span || options.MaxBeta - beta < 1e-6 * span;

        return new WignerFitResult(
            areas.Length,
            window.Count,
            beta,
            lower,
            upper,
            options.ConfidenceLevel,
            atBound,
            MomentBeta(variance, options.MinBeta, options.MaxBeta),
            variance,
            options.MinS,
            options.MaxS,
            options.Mapping,
            CriticalNucleus.FromBeta(beta, options.Mapping),
            CriticalNucleus.Describe(options.Mapping));
    }

    /// <summary>β with Var(s) = (β+1)/(2b_β) − 1 equal to <paramref name="variance"/>; NaN outside [minBeta, maxBeta].</summary>
    public static double MomentBeta(double variance, double minBeta = 0.0, double maxBeta = 60.0)
    {
        if (!double.IsFinite(variance))
        {
            return double.NaN;
        }
        double F(double b) => WignerSurmise.Variance(b) - variance;
        double fLow = F(minBeta), fHigh = F(maxBeta);
        // Var(s) falls as β grows, so a root exists only when fLow ≥ 0 ≥ fHigh.
        if (fLow < 0.0 || fHigh > 0.0)
        {
            return double.NaN;
        }
        return Brent.FindRoot(F, minBeta, maxBeta, 1e-10, 200);
    }

    /// <summary>Coarse scan (the likelihood may be flat for few data), then golden-section refinement (MathNet).</summary>
    private static double Maximise(Sufficient data, double minBeta, double maxBeta)
    {
        double best = minBeta, bestValue = data.LogLikelihood(minBeta);
        for (double b = minBeta + ScanStep; b <= maxBeta; b += ScanStep)
        {
            double v = data.LogLikelihood(b);
            if (v > bestValue)
            {
                bestValue = v;
                best = b;
            }
        }
        double lo = Math.Max(minBeta, best - ScanStep), hi = Math.Min(maxBeta, best + ScanStep);
        double refined = FindMinimum.OfScalarFunctionConstrained(b => -data.LogLikelihood(b), lo, hi, 1e-9, 10_000);
        return data.LogLikelihood(refined) >= bestValue ? refined : best;
    }

    /// <summary>Sufficient statistics Σ ln s and Σ s² of the window, and the truncated log-likelihood.</summary>
    private sealed class Sufficient(List<double> s, double minS, double maxS)
    {
        private readonly int _n = s.Count;
        private readonly double _sumLog = SumLog(s);
        private readonly double _sumSquares = SumSquares(s);
        private readonly bool _truncated = minS > 0.0 || double.IsFinite(maxS);

        public double LogLikelihood(double beta)
        {
            (double lnA, double b) = WignerSurmise.LogCoefficients(beta);
            double value = (_n * lnA) + (beta * _sumLog) - (b * _sumSquares);
            if (_truncated)
            {
                double shape = 0.5 * (beta + 1.0);
                double upper = double.IsFinite(maxS) ? SpecialFunctions.GammaLowerRegularized(shape, b * maxS * maxS) : 1.0;
                double lower = minS > 0.0 ? SpecialFunctions.GammaLowerRegularized(shape, b * minS * minS) : 0.0;
                value -= _n * Math.Log(Math.Max(upper - lower, double.Epsilon));
            }
            return value;
        }

        private static double SumLog(List<double> s)
        {
            double sum = 0.0;
            foreach (double v in s)
            {
                sum += Math.Log(v);
            }
            return sum;
        }

        private static double SumSquares(List<double> s)
        {
            double sum = 0.0;
            foreach (double v in s)
            {
                sum += v * v;
            }
            return sum;
        }
    }
}
