namespace RunWatch.Imaging.Analysis;

/// <summary>
/// Summary of a sample. SD is the sample standard deviation (n − 1); percentiles interpolate linearly between
/// order statistics (Hyndman &amp; Fan 1996, definition 7, numpy's default).
/// </summary>
public sealed record DistributionSummary
{
    public required int Count { get; init; }
    public required double Mean { get; init; }
    public required double Median { get; init; }
    public required double StandardDeviation { get; init; }
    /// <summary>SD / mean.</summary>
    public required double CoefficientOfVariation { get; init; }
    public required double Min { get; init; }
    public required double Max { get; init; }
    public required double P05 { get; init; }
    public required double P10 { get; init; }
    public required double P25 { get; init; }
    public required double P75 { get; init; }
    public required double P90 { get; init; }
    public required double P95 { get; init; }
    /// <summary>Bin edges (<see cref="HistogramCounts"/>.Length + 1 values, equal widths from min to max).</summary>
    public required IReadOnlyList<double> HistogramEdges { get; init; }
    public required IReadOnlyList<int> HistogramCounts { get; init; }

    /// <summary>Summarises <paramref name="values"/> (not modified); null when empty.</summary>
    public static DistributionSummary? Of(ReadOnlySpan<double> values, int bins = 20)
    {
        int n = values.Length;
        if (n == 0)
        {
            return null;
        }
        double[] sorted = values.ToArray();
        Array.Sort(sorted);
        double mean = 0;
        for (int i = 0; i < n; i++)
        {
            mean += sorted[i];
        }
        mean /= n;
        double ss = 0;
        for (int i = 0; i < n; i++)
        {
            ss += (sorted[i] - mean) * (sorted[i] - mean);
        }
        double sd = n > 1 ? Math.Sqrt(ss / (n - 1)) : 0;
        double min = sorted[0];
        double max = sorted[^1];
        int binCount = max > min ? bins : 1;
        var edges = new double[binCount + 1];
        for (int b = 0; b <= binCount; b++)
        {
            edges[b] = binCount == 1 && max == min ? min + b : min + (max - min) * b / binCount;
        }
        var counts = new int[binCount];
        for (int i = 0; i < n; i++)
        {
            int b = max > min ? (int)((sorted[i] - min) / (max - min) * binCount) : 0;
            counts[Math.Min(b, binCount - 1)]++;
        }
        return new DistributionSummary
        {
            Count = n,
            Mean = mean,
            Median = Percentile(sorted, 50),
            StandardDeviation = sd,
            CoefficientOfVariation = mean != 0 ? sd / mean : double.NaN,
            Min = min,
            Max = max,
            P05 = Percentile(sorted, 5),
            P10 = Percentile(sorted, 10),
            P25 = Percentile(sorted, 25),
            P75 = Percentile(sorted, 75),
            P90 = Percentile(sorted, 90),
            P95 = Percentile(sorted, 95),
            HistogramEdges = edges,
            HistogramCounts = counts,
        };
    }

    /// <summary>Linear-interpolation percentile of a sorted sample.</summary>
    public static double Percentile(ReadOnlySpan<double> sorted, double percent)
    {
        double h = (sorted.Length - 1) * percent / 100.0;
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, sorted.Length - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }
}
