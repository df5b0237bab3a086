namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Otsu's threshold (Otsu, N. (1979) "A threshold selection method from gray-level histograms", IEEE Trans.
/// SMC-9(1), 62–66): the level t maximising the between-class variance ω₀ω₁(μ₀−μ₁)² with one histogram bin per
/// integer level between the image's minimum and maximum. Background is value ≤ t, foreground value &gt; t.
/// Tie rule: among equal maxima the lowest t wins (the same as scikit-image's <c>threshold_otsu</c>, whose
/// integer-image arithmetic this follows step by step, so the two agree exactly). An image with a single value
/// returns that value (nothing is foreground).
/// </summary>
internal static class OtsuThreshold
{
    public static int Compute(ReadOnlySpan<ushort> pixels)
    {
        if (pixels.IsEmpty)
        {
            throw new ArgumentException("no pixels", nameof(pixels));
        }
        var histogram = new long[ushort.MaxValue + 1];
        for (int i = 0; i < pixels.Length; i++)
        {
            histogram[pixels[i]]++;
        }
        return FromHistogram(histogram);
    }

    /// <summary>Threshold from counts per level (index = level).</summary>
    public static int FromHistogram(ReadOnlySpan<long> histogram)
    {
        int lo = 0;
        while (lo < histogram.Length && histogram[lo] == 0)
        {
            lo++;
        }
        if (lo == histogram.Length)
        {
            throw new ArgumentException("empty histogram", nameof(histogram));
        }
        int hi = histogram.Length - 1;
        while (histogram[hi] == 0)
        {
            hi--;
        }
        if (lo == hi)
        {
            return lo;
        }
        long totalCount = 0;
        long totalSum = 0;
        for (int v = lo; v <= hi; v++)
        {
            totalCount += histogram[v];
            totalSum += histogram[v] * v;
        }
        long w1 = 0;
        long s1 = 0;
        double best = double.NegativeInfinity;
        int bestT = lo;
        for (int t = lo; t < hi; t++)
        {
            w1 += histogram[t];
            s1 += histogram[t] * t;
            long w2 = totalCount - w1;
            double mean1 = (double)s1 / w1;
            double mean2 = (double)(totalSum - s1) / w2;
            double d = mean1 - mean2;
            double variance = (double)(w1 * w2) * (d * d);
            // Strict '>' keeps the lowest t among ties.
            if (variance > best)
            {
                best = variance;
                bestT = t;
            }
        }
        return bestT;
    }
}
