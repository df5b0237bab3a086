using RunWatch.Imaging.Segmentation;
using Xunit;

namespace RunWatch.Imaging.Tests.Segmentation;

public sealed class OtsuThresholdTests
{
    [Fact]
    public void Compute_SkimageFiveByFiveImage_ReturnsTwo()
    {
        // CONFIRMED: scikit-image test suite, TestSimpleImage.test_otsu, threshold_otsu(image) == 2
        // (Otsu, N. (1979) IEEE Trans. SMC-9(1), 62–66); shared/CHECKS.md §5.
        ushort[] image =
        [
            0, 0, 1, 3, 5,
            0, 1, 4, 3, 4,
            1, 2, 5, 4, 1,
            2, 4, 5, 2, 1,
            4, 5, 1, 0, 0,
        ];
        Assert.Equal(2, OtsuThreshold.Compute(image));
    }

    [Fact]
    public void FromHistogram_GreenstedExample_ReturnsTwo()
    {
        // FROM MEMORY: A. Greensted, "Otsu Thresholding", The Lab Book Pages: histogram [8,7,2,6,9,4] on levels
        // 0..5 puts {0,1,2} in the background. Intermediate values COMPUTED HERE in shared/CHECKS.md §5:
        // σ_B² = 2.6287 at t = 2, which this check recomputes independently of the implementation.
        long[] histogram = [8, 7, 2, 6, 9, 4];
        Assert.Equal(2, OtsuThreshold.FromHistogram(histogram));
        double w0 = 17.0 / 36, mu0 = (0 * 8 + 1 * 7 + 2 * 2) / 17.0, mu1 = (3 * 6 + 4 * 9 + 5 * 4) / 19.0;
        Assert.Equal(2.6287, w0 * (1 - w0) * (mu0 - mu1) * (mu0 - mu1), 4);
        Assert.Equal(0.6471, mu0, 4);
        Assert.Equal(3.8947, mu1, 4);
    }

    [Fact]
    public void FromHistogram_EmptyBinsBetweenModes_TakesLowestTiedLevel()
    {
        // COMPUTED HERE (CHECKS.md §5): only levels 10, 20 and 200 populated; every t in [20, 199] ties.
        // Pinned rule: the lowest t (scikit-image's argmax also takes the first maximum).
        var histogram = new long[256];
        histogram[10] = 50;
        histogram[20] = 50;
        histogram[200] = 100;
        Assert.Equal(20, OtsuThreshold.FromHistogram(histogram));
    }

    [Fact]
    public void Compute_SingleValue_ReturnsThatValueSoNothingIsForeground()
    {
        ushort[] image = [7, 7, 7, 7];
        Assert.Equal(7, OtsuThreshold.Compute(image));
    }

    [Fact]
    public void FromHistogram_RandomHistograms_MatchesBruteForceWithinClassVariance()
    {
        // DERIVED: σ_B² + σ_W² = σ_T², so maximising between-class variance minimises the weighted within-class
        // variance. A naive minimiser of σ_W² (independent formula) must pick the same level.
        var random = new Random(11);
        for (int trial = 0; trial < 200; trial++)
        {
            var histogram = new long[32];
            for (int i = 0; i < histogram.Length; i++)
            {
                histogram[i] = random.Next(0, 4) == 0 ? 0 : random.Next(1, 1000);
            }
            histogram[0] = Math.Max(histogram[0], 1);
            histogram[^1] = Math.Max(histogram[^1], 1);
            int expected = NaiveWithinClassMinimum(histogram);
            Assert.Equal(expected, OtsuThreshold.FromHistogram(histogram));
        }
    }

    private static int NaiveWithinClassMinimum(long[] histogram)
    {
        double best = double.PositiveInfinity;
        int bestT = -1;
        for (int t = 0; t < histogram.Length - 1; t++)
        {
            double within = ClassVariance(histogram, 0, t) + ClassVariance(histogram, t + 1, histogram.Length - 1);
            if (bestT < 0 || within < best * (1 - 1e-12))
            {
                best = within;
                bestT = t;
            }
        }
        return bestT;
    }

    private static double ClassVariance(long[] h, int from, int to)
    {
        double n = 0, sum = 0;
        for (int v = from; v <= to; v++)
        {
            n += h[v];
            sum += h[v] * (double)v;
        }
        if (n == 0)
        {
            return 0;
        }
        double mean = sum / n, ss = 0;
        for (int v = from; v <= to; v++)
        {
            ss += h[v] * (v - mean) * (v - mean);
        }
        return ss;
    }
}
