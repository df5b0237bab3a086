using RunWatch.Imaging.Segmentation;
using Xunit;

namespace RunWatch.Imaging.Tests.Segmentation;

public sealed class DistanceTransformTests
{
    [Theory]
    [InlineData(1, 0.02)]
    [InlineData(2, 0.2)]
    [InlineData(3, 0.001)]
    public void Compute_RandomFeatures_MatchesBruteForce(int seed, double density)
    {
        // COMMON PRACTICE: the exact EDT (Felzenszwalb & Huttenlocher 2012) against brute force over all features.
        var random = new Random(seed);
        int w = 53, h = 41;
        var features = new int[w * h];
        for (int i = 0; i < features.Length; i++)
        {
            features[i] = random.NextDouble() < density ? 1 : 0;
        }
        features[random.Next(features.Length)] = 1;
        var d2 = new int[w * h];
        var nearest = new int[w * h];
        DistanceTransform.Compute(features, w, h, d2, nearest);
        for (int y = 0; y < h; y++)
        {
            for (int x = 0; x < w; x++)
            {
                int best = int.MaxValue;
                for (int j = 0; j < features.Length; j++)
                {
                    if (features[j] != 0)
                    {
                        int dx = j % w - x, dy = j / w - y;
                        best = Math.Min(best, dx * dx + dy * dy);
                    }
                }
                int i = y * w + x;
                Assert.Equal(best, d2[i]);
                Assert.NotEqual(0, features[nearest[i]]);
                int fx = nearest[i] % w - x, fy = nearest[i] / w - y;
                Assert.Equal(best, fx * fx + fy * fy);
            }
        }
    }

    [Fact]
    public void Compute_NoFeature_GivesInfiniteDistanceAndNoIndex()
    {
        var features = new int[12];
        var d2 = new int[12];
        var nearest = new int[12];
        DistanceTransform.Compute(features, 4, 3, d2, nearest);
        Assert.All(d2, d => Assert.Equal(DistanceTransform.Infinite, d));
        Assert.All(nearest, n => Assert.Equal(DistanceTransform.NoFeature, n));
    }
}
