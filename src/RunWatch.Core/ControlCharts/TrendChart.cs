namespace RunWatch.Core.ControlCharts;

/// <summary>
/// One figure's control chart across runs. The baseline is the first <c>baselineRuns</c> points (in the order
/// given, oldest first) that are accepted and finite; their <see cref="IndividualsLimits"/> set the centre line
/// and limits, and the Western Electric rules judge every point against them. Points after the baseline are
/// judged against limits they did not set; baseline points are judged too (a baseline that breaks the rules shows it).
/// </summary>
/// <param name="BaselineIndices">Indices of the baseline points.</param>
/// <param name="Limits">Centre and limits; null when the baseline has fewer than two points or no spread.</param>
/// <param name="Signals">Run-rule signals, by point index.</param>
public sealed record TrendChart(IReadOnlyList<int> BaselineIndices, IndividualsLimits? Limits, IReadOnlyList<RunRuleSignal> Signals)
{
    /// <summary>Builds the chart of <paramref name="values"/>; <paramref name="accepted"/> says which points may form the baseline.</summary>
    /// <exception cref="ArgumentException">The spans differ in length.</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="baselineRuns"/> is below 2.</exception>
    public static TrendChart Build(ReadOnlySpan<double> values, ReadOnlySpan<bool> accepted, int baselineRuns)
    {
        if (values.Length != accepted.Length)
        {
            throw new ArgumentException("Values and accepted flags differ in length.", nameof(accepted));
        }
        ArgumentOutOfRangeException.ThrowIfLessThan(baselineRuns, 2);
        var indices = new List<int>(baselineRuns);
        var baseline = new double[Math.Min(baselineRuns, values.Length)];
        for (int i = 0; i < values.Length && indices.Count < baselineRuns; i++)
        {
            if (accepted[i] && double.IsFinite(values[i]))
            {
                baseline[indices.Count] = values[i];
                indices.Add(i);
            }
        }
        IndividualsLimits? limits = IndividualsLimits.FromBaseline(baseline.AsSpan(0, indices.Count));
        IReadOnlyList<RunRuleSignal> signals = limits is null ? [] : WesternElectricRules.Evaluate(values, limits.Centre, limits.Sigma);
        return new TrendChart(indices, limits, signals);
    }

    /// <summary>Mean of the finite values; NaN when there are none (a run's figure from its wafers' figures).</summary>
    public static double MeanOfFinite(ReadOnlySpan<double> values)
    {
        double sum = 0;
        int n = 0;
        foreach (double v in values)
        {
            if (double.IsFinite(v))
            {
                sum += v;
                n++;
            }
        }
        return n == 0 ? double.NaN : sum / n;
    }
}
