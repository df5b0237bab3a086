using System.Runtime.CompilerServices;

namespace RunWatch.Core.Thermal;

/// <summary>
/// Integrates Arrhenius diffusivity over a sampled temperature history.
/// <para>
/// Rule: between two consecutive samples the true temperature is taken as linear in time (T(t) is the
/// piecewise-linear interpolant of the calibrated samples), and ∫D dt over each segment is computed exactly for
/// that interpolant, up to rounding:
/// </para>
/// <list type="bullet">
/// <item>small steps (|Δx| ≤ 0.1 and |ΔT/T| ≤ 0.01, with x = Ea/(kB·T)): the exponential-fit rule
/// Δt·(f₁−f₀)/Δx with f = e^{−x}, times a curvature correction for the convexity of 1/T in t
/// (series to second order in Δx·ΔT/T; checked against the closed form to about 1e-11);</item>
/// <item>larger steps: the closed form ∫ e^{−a/T} dt = Δt/ΔT·[T₁·E2(a/T₁) − T₀·E2(a/T₀)] (DERIVED; equivalent
/// to F(T) = T·e^{−a/T} − a·E1(a/T)), evaluated through scaled E2 to avoid cancellation.</item>
/// </list>
/// <para>
/// Gap policy: a segment longer than the gap limit is not integrated (no interpolation across it); it is reported
/// as a gap and lowers the coverage. The parts of the window before the first and after the last sample are
/// uncovered as well, and reported when longer than the limit. At most one exp per sample; no allocation.
/// </para>
/// </summary>
public static class ThermalIntegrator
{
    private const double FastRuleMaxStepX = 0.1;
    private const double FastRuleMaxRelativeStep = 0.01;

    /// <summary>
    /// ∫₀^Δt exp(−a/T(t)) dt in s, for T linear from <paramref name="startK"/> to <paramref name="endK"/> over
    /// <paramref name="durationS"/>, with a = <paramref name="activationK"/> (Ea/kB, any sign).
    /// </summary>
    public static double SegmentIntegralS(double durationS, double startK, double endK, double activationK)
    {
        double invA = 1 / startK;
        double xA = activationK * invA;
        double xB = activationK / endK;
        return Segment(durationS, startK, endK, invA, xA, xB, Math.Exp(-xA), Math.Exp(-xB), activationK);
    }

    /// <summary>
    /// ∫D dt in cm² over the window [<paramref name="startS"/>, <paramref name="endS"/>] of the record given by
    /// <paramref name="timesS"/> (non-decreasing) and <paramref name="readingsC"/>, after
    /// <paramref name="calibration"/>. Uncovered intervals longer than <paramref name="maxGapS"/> are counted and,
    /// when <paramref name="gaps"/> is given, added to it.
    /// </summary>
    public static IntegrationResult Integrate(
        ReadOnlySpan<double> timesS,
        ReadOnlySpan<double> readingsC,
        TemperatureCalibration calibration,
        ArrheniusDiffusivity diffusivity,
        double startS,
        double endS,
        double maxGapS,
        ICollection<RecordGap>? gaps = null)
    {
        ArgumentNullException.ThrowIfNull(calibration);
        if (timesS.Length != readingsC.Length)
        {
            throw new ArgumentException("Times and readings differ in length.", nameof(readingsC));
        }
        double windowS = Math.Max(0, endS - startS);
        var tally = new GapTally(maxGapS, gaps);
        if (windowS == 0)
        {
            return new IntegrationResult(0, 0, 0, 0, 0);
        }
        if (timesS.Length == 0 || timesS[^1] <= startS || timesS[0] >= endS)
        {
            tally.Uncovered(startS, endS);
            return new IntegrationResult(0, 0, windowS, tally.Count, tally.Longest);
        }

        double a = diffusivity.ActivationTemperatureK;
        int first = LowerBound(timesS, startS);
        int k = Math.Max(first - 1, 0);
        if (timesS[k] > startS)
        {
            tally.Uncovered(startS, timesS[k]);
        }
        // Specialise the loop on the calibration: the common offset-only case then inlines to one addition.
        var (sum, covered, lastTime) = calibration.TryGetOffsetK(out double offsetK)
            ? Accumulate(new OffsetMap(offsetK + PhysicalConstants.ZeroCelsiusK), timesS, readingsC, k, a, startS, endS, maxGapS, ref tally)
            : Accumulate(new CalibrationMap(calibration), timesS, readingsC, k, a, startS, endS, maxGapS, ref tally);
        if (!double.IsFinite(sum))
        {
            throw new ArgumentException("A reading or time in the window is not finite.", nameof(readingsC));
        }
        if (lastTime < endS)
        {
            tally.Uncovered(Math.Max(lastTime, startS), endS);
        }
        return new IntegrationResult(diffusivity.D0CmSqPerS * sum, covered, windowS, tally.Count, tally.Longest);
    }

    private static (double Sum, double Covered, double LastTime) Accumulate<TMap>(
        TMap map, ReadOnlySpan<double> timesS, ReadOnlySpan<double> readingsC, int k, double a, double startS, double endS, double maxGapS, ref GapTally tally)
        where TMap : struct, ITemperatureMap
    {
        double tA = timesS[k];
        double kA = map.ToKelvin(readingsC[k]);
        double invA = 1 / kA;
        double xA = a * invA;
        double fA = Math.Exp(-xA);
        double sum = 0;
        double covered = 0;
        int last = timesS.Length - 1;
        for (int i = k + 1; i <= last && tA < endS; i++)
        {
            double tB = timesS[i];
            double kB = map.ToKelvin(readingsC[i]);
            double invB = 1 / kB;
            double xB = a * invB;
            double step = xA - xB;
            // e^{−xB} = e^{−xA}·e^{step}: for small steps a Taylor factor (truncation < 2e-18) replaces exp; a true
            // exp every 64 samples bounds the rounding drift of the product.
            double fB = Math.Abs(step) < 1e-2 && (i & 63) != 0
                ? fA * (1 + step * (1 + step * (1.0 / 2 + step * (1.0 / 6 + step * (1.0 / 24 + step * (1.0 / 120 + step * (1.0 / 720)))))))
                : Math.Exp(-xB);
            double dt = tB - tA;
            if (dt < 0)
            {
                ThrowTimeGoesBackwards(i, tA, tB);
            }
            if (dt > maxGapS)
            {
                tally.Uncovered(Math.Max(tA, startS), Math.Min(tB, endS));
            }
            else if (tA >= startS && tB <= endS)
            {
                sum += Segment(dt, kA, kB, invA, xA, xB, fA, fB, a);
                covered += dt;
            }
            else if (dt > 0)
            {
                // The segment straddles a window edge: integrate the part inside, on the same interpolant.
                double lo = Math.Max(tA, startS);
                double hi = Math.Min(tB, endS);
                if (hi > lo)
                {
                    double kLo = kA + (kB - kA) * ((lo - tA) / dt);
                    double kHi = kA + (kB - kA) * ((hi - tA) / dt);
                    sum += SegmentIntegralS(hi - lo, kLo, kHi, a);
                    covered += hi - lo;
                }
            }
            tA = tB;
            kA = kB;
            invA = invB;
            xA = xB;
            fA = fB;
        }
        return (sum, covered, tA);
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void ThrowTimeGoesBackwards(int index, double before, double after) =>
        throw new ArgumentException($"Time goes backwards at sample {index} ({after} s after {before} s).", "timesS");

    /// <summary>First index whose time is ≥ <paramref name="t"/> (the length when none).</summary>
    internal static int LowerBound(ReadOnlySpan<double> timesS, double t)
    {
        int lo = 0;
        int hi = timesS.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (timesS[mid] < t)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }
        return lo;
    }

    /// <summary>One segment; 1/T₀, x = a/T and f = e^{−x} at both ends are passed in so each sample costs at most one exp.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double Segment(double dt, double kA, double kB, double invA, double xA, double xB, double fA, double fB, double a)
    {
        double lambda = xA - xB;
        double r = (kB - kA) * invA;
        if (Math.Abs(lambda) <= FastRuleMaxStepX && Math.Abs(r) <= FastRuleMaxRelativeStep)
        {
            // ∫₀¹ exp(−x(s)) ds with x(s) = a/(T₀(1+r·s)): −x(s) = −x₀ + λ·s + δ(s),
            // δ(s) = λ·r·s(1−s)/(1+r·s) exactly (DERIVED). Average of e^δ under the weight e^{λs}, to second order.
            double mean = Math.Abs(lambda) < 1e-2
                ? fA * (1 + lambda * (1.0 / 2 + lambda * (1.0 / 6 + lambda * (1.0 / 24 + lambda * (1.0 / 120 + lambda * (1.0 / 720))))))
                : (fB - fA) / lambda;
            double curvature = lambda * r;
            // Constants as reciprocals: the JIT does not turn a division by a constant into a multiplication.
            double correction = curvature * ((1.0 / 6) - lambda * lambda * (1.0 / 360) - r * (1.0 / 12) - r * lambda * (1.0 / 120) + r * r * (1.0 / 20))
                + curvature * curvature * (1.0 / 60);
            return dt * mean * (1 + correction);
        }
        return dt * LargeStep(kA, kB, xA, xB, fA, fB, a);
    }

    // Mean of exp(−a/T) over a segment too long for the fast rule.
    [MethodImpl(MethodImplOptions.NoInlining)]
    private static double LargeStep(double kA, double kB, double xA, double xB, double fA, double fB, double a)
    {
        if (a > 0 && kA != kB)
        {
            // (1/ΔT)·[T·E2(a/T)] between the ends, with T·E2(x) = T·e^{−x}·(eˣE2(x)).
            double fB2 = kB * fB * ExponentialIntegral.ScaledE2(xB);
            double fA2 = kA * fA * ExponentialIntegral.ScaledE2(xA);
            return (fB2 - fA2) / (kB - kA);
        }
        // a ≤ 0 (a lifetime product with E_d > Ea): split until the fast rule applies.
        int parts = (int)Math.Ceiling(Math.Max(Math.Abs(xA - xB) / FastRuleMaxStepX, Math.Abs(kB - kA) / (FastRuleMaxRelativeStep * Math.Min(kA, kB)))) + 1;
        double mean = 0;
        double kPrev = kA;
        double xPrev = xA;
        double fPrev = fA;
        for (int j = 1; j <= parts; j++)
        {
            double kNext = j == parts ? kB : kA + (kB - kA) * j / parts;
            double xNext = a / kNext;
            double fNext = Math.Exp(-xNext);
            mean += Segment(1.0 / parts, kPrev, kNext, 1 / kPrev, xPrev, xNext, fPrev, fNext, a);
            kPrev = kNext;
            xPrev = xNext;
            fPrev = fNext;
        }
        return mean;
    }
}
