namespace RunWatch.Core.ControlCharts;

/// <summary>
/// Applies the Western Electric run rules (<see cref="RunRule"/>) to a sequence of values against a centre line and
/// σ taken from an accepted baseline (not from the values judged). A pattern is reported at the point that
/// completes it (the first points of a series form shorter windows); the points judged are only those of the same side for rules 2 and 3. Non-finite values are skipped
/// (they break no pattern and complete none). Pure; allocates only the result.
/// </summary>
public static class WesternElectricRules
{
    /// <summary>Every rule that fires, ordered by index, then rule.</summary>
    /// <exception cref="ArgumentOutOfRangeException">σ is not positive and finite, or the centre is not finite.</exception>
    public static IReadOnlyList<RunRuleSignal> Evaluate(ReadOnlySpan<double> values, double centre, double sigma)
    {
        if (!double.IsFinite(centre))
        {
            throw new ArgumentOutOfRangeException(nameof(centre), centre, "The centre line must be finite.");
        }
        if (!(sigma > 0) || !double.IsFinite(sigma))
        {
            throw new ArgumentOutOfRangeException(nameof(sigma), sigma, "σ must be positive and finite.");
        }
        var signals = new List<RunRuleSignal>();
        // z-scores of the finite points, and where each came from.
        var z = new double[values.Length];
        var at = new int[values.Length];
        int n = 0;
        for (int i = 0; i < values.Length; i++)
        {
            if (double.IsFinite(values[i]))
            {
                z[n] = (values[i] - centre) / sigma;
                at[n] = i;
                n++;
            }
        }
        for (int k = 0; k < n; k++)
        {
            if (Math.Abs(z[k]) > 3)
            {
                signals.Add(new RunRuleSignal(at[k], RunRule.OneBeyondThreeSigma));
            }
            if (Completes(z, k, 3, 2, 2))
            {
                signals.Add(new RunRuleSignal(at[k], RunRule.TwoOfThreeBeyondTwoSigma));
            }
            if (Completes(z, k, 5, 4, 1))
            {
                signals.Add(new RunRuleSignal(at[k], RunRule.FourOfFiveBeyondOneSigma));
            }
            if (k >= 7 && SameSide(z, k - 7, k))
            {
                signals.Add(new RunRuleSignal(at[k], RunRule.EightOnOneSide));
            }
        }
        return signals;
    }

    /// <summary>
    /// Whether point k completes "<paramref name="needed"/> of <paramref name="window"/> consecutive points beyond
    /// <paramref name="limit"/> σ on one side": the window ending at k holds enough such points and k is one of them.
    /// </summary>
    private static bool Completes(double[] z, int k, int window, int needed, double limit) =>
        (z[k] > limit && CountBeyond(z, Math.Max(0, k - window + 1), k, limit, +1) >= needed)
        || (z[k] < -limit && CountBeyond(z, Math.Max(0, k - window + 1), k, limit, -1) >= needed);

    private static int CountBeyond(double[] z, int from, int to, double limit, int side)
    {
        int count = 0;
        for (int i = from; i <= to; i++)
        {
            count += side > 0 ? (z[i] > limit ? 1 : 0) : (z[i] < -limit ? 1 : 0);
        }
        return count;
    }

    private static bool SameSide(double[] z, int from, int to)
    {
        bool above = z[from] > 0;
        for (int i = from; i <= to; i++)
        {
            if (z[i] == 0 || (z[i] > 0) != above)
            {
                return false;
            }
        }
        return true;
    }
}
