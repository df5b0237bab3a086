using Xunit;
using RunWatch.Core.Charting;

namespace RunWatch.Core.Tests.Charting;

public sealed class LttbTests
{
    // Reference: a deliberately plain re-implementation from the algorithm's description in Steinarsson (2013),
    // "Downsampling Time Series for Visual Representation", MSc thesis, University of Iceland, section 4.2:
    // buckets built explicitly as lists, the triangle area by the shoelace formula with its 1/2. CONFIRMED (thesis text).
    private static int[] NaiveLttb(double[] x, double[] y, int threshold)
    {
        int n = x.Length;
        if (threshold >= n)
        {
            return Enumerable.Range(0, n).ToArray();
        }
        var buckets = new List<List<int>>();
        double every = (double)(n - 2) / (threshold - 2);
        for (int b = 0; b < threshold - 2; b++)
        {
            int from = (int)Math.Floor(b * every) + 1;
            int to = (int)Math.Floor((b + 1) * every) + 1;
            buckets.Add(Enumerable.Range(from, to - from).ToList());
        }
        buckets.Add([n - 1]);
        var kept = new List<int> { 0 };
        for (int b = 0; b < threshold - 2; b++)
        {
            var next = buckets[b + 1];
            double cx = next.Average(i => x[i]);
            double cy = next.Average(i => y[i]);
            int a = kept[^1];
            int best = buckets[b].OrderByDescending(i =>
                0.5 * Math.Abs((x[a] * (y[i] - cy)) + (x[i] * (cy - y[a])) + (cx * (y[a] - y[i])))).ThenBy(i => i).First();
            kept.Add(best);
        }
        kept.Add(n - 1);
        return kept.ToArray();
    }

    private static (double[] X, double[] Y) RandomWalk(int n, int seed)
    {
        var random = new Random(seed);
        var x = new double[n];
        var y = new double[n];
        double v = 600;
        double t = 0;
        for (int i = 0; i < n; i++)
        {
            t += 0.05 + (random.NextDouble() * 0.1);
            v += random.NextDouble() - 0.5;
            x[i] = t;
            y[i] = v;
        }
        return (x, y);
    }

    [Theory]
    [InlineData(1_000, 100, 1)]
    [InlineData(10_000, 500, 2)]
    [InlineData(12_345, 777, 3)]
    [InlineData(50, 3, 4)]
    [InlineData(5_001, 5_000, 5)]
    public void SelectIndices_RandomSeries_MatchesNaiveReference(int n, int threshold, int seed)
    {
        var (x, y) = RandomWalk(n, seed);
        var indices = new int[threshold];

        int count = Lttb.SelectIndices(x, y, indices);

        Assert.Equal(threshold, count);
        Assert.Equal(NaiveLttb(x, y, threshold), indices);
    }

    [Fact]
    public void SelectIndices_HandWorkedExample_KeepsThePeak()
    {
        // DERIVED by hand: n = 5, threshold 3 gives one inner bucket {1, 2, 3}; the next "bucket" is the last point (4, 0),
        // so the triangle (0,0)-(x,y)-(4,0) has area 2·|y| and the peak at index 1 (y = 5) wins.
        double[] x = [0, 1, 2, 3, 4];
        double[] y = [0, 5, 1, 1, 0];
        var indices = new int[3];

        Lttb.SelectIndices(x, y, indices);

        Assert.Equal([0, 1, 4], indices);
    }

    [Fact]
    public void SelectIndices_LongSeries_KeepsFirstLastAndOnePointPerBucket()
    {
        var (x, y) = RandomWalk(360_000, 7);
        var indices = new int[5_000];

        int count = Lttb.SelectIndices(x, y, indices);

        Assert.Equal(5_000, count);
        Assert.Equal(0, indices[0]);
        Assert.Equal(359_999, indices[^1]);
        double every = (360_000 - 2) / (5_000.0 - 2);
        for (int b = 0; b < 5_000 - 2; b++)
        {
            int from = (int)Math.Floor(b * every) + 1;
            int to = (int)Math.Floor((b + 1) * every) + 1;
            Assert.InRange(indices[b + 1], from, to - 1);
        }
    }

    [Fact]
    public void SelectIndices_SeriesNotLongerThanThreshold_ReturnsEveryPointExactly()
    {
        var (x, y) = RandomWalk(40, 11);
        var outX = new double[100];
        var outY = new double[100];
        var scratch = new int[100];

        int count = Lttb.Downsample(x, y, outX, outY, scratch);

        Assert.Equal(40, count);
        Assert.Equal(x, outX[..40]);
        Assert.Equal(y, outY[..40]);
    }

    [Fact]
    public void SelectIndices_ThresholdBelowThree_Throws()
    {
        var (x, y) = RandomWalk(10, 1);
        Assert.Throws<ArgumentException>(() => Lttb.SelectIndices(x, y, new int[2]));
    }

    [Fact]
    public void SelectIndices_LengthsDiffer_Throws()
    {
        Assert.Throws<ArgumentException>(() => Lttb.SelectIndices(new double[10], new double[9], new int[5]));
    }
}
