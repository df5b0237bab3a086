namespace RunWatch.Core.ControlCharts;

/// <summary>
/// Centre line and 3σ limits of an individuals (X) chart from a baseline: centre = baseline mean,
/// σ̂ = MR̄ / d₂ with MR̄ the mean moving range of consecutive baseline points and d₂ = 2/√π ≈ 1.128 (the expected
/// range of two normal observations in σ units, E|X₁ − X₂| = 2σ/√π: DERIVED; the handbook constant 1.128 is in
/// NIST/SEMATECH e-Handbook 6.3.2.2, FROM MEMORY). The moving range keeps a slow drift inside the baseline from
/// widening the limits, as the sample SD would.
/// </summary>
/// <param name="BaselineCount">Baseline points used.</param>
/// <param name="Centre">Centre line.</param>
/// <param name="Sigma">σ̂ from the moving range.</param>
public sealed record IndividualsLimits(int BaselineCount, double Centre, double Sigma)
{
    /// <summary>d₂ for ranges of two observations: 2/√π.</summary>
    public static readonly double D2 = 2 / Math.Sqrt(Math.PI);

    /// <summary>Lower control limit, centre − 3σ̂.</summary>
    public double Lower => Centre - (3 * Sigma);

    /// <summary>Upper control limit, centre + 3σ̂.</summary>
    public double Upper => Centre + (3 * Sigma);

    /// <summary>Limits from the finite baseline values in order; null with fewer than two of them or no spread (σ̂ = 0).</summary>
    public static IndividualsLimits? FromBaseline(ReadOnlySpan<double> baseline)
    {
        int n = 0;
        double sum = 0;
        double rangeSum = 0;
        double previous = double.NaN;
        foreach (double v in baseline)
        {
            if (!double.IsFinite(v))
            {
                continue;
            }
            if (n > 0)
            {
                rangeSum += Math.Abs(v - previous);
            }
            previous = v;
            sum += v;
            n++;
        }
        if (n < 2)
        {
            return null;
        }
        double sigma = rangeSum / (n - 1) / D2;
        return sigma > 0 ? new IndividualsLimits(n, sum / n, sigma) : null;
    }
}
