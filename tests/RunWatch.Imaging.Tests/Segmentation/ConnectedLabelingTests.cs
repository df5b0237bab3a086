using RunWatch.Imaging.Segmentation;
using Xunit;

namespace RunWatch.Imaging.Tests.Segmentation;

public sealed class ConnectedLabelingTests
{
    [Theory]
    [InlineData(1, 0.35)]
    [InlineData(2, 0.5)]
    [InlineData(3, 0.6)]
    public void Label_RandomMasks_MatchesNaiveFloodFill(int seed, double fill)
    {
        // COMMON PRACTICE: compare the two-pass union-find against a naive 8-connected flood fill.
        var random = new Random(seed);
        int w = 97, h = 61;
        var pixels = new ushort[w * h];
        for (int i = 0; i < pixels.Length; i++)
        {
            pixels[i] = random.NextDouble() < fill ? (ushort)10 : (ushort)0;
        }
        var labels = new int[w * h];
        int count = ConnectedLabeling.Label(pixels, w, h, 5, labels, out ComponentBox[] boxes);
        int[] naive = FloodFill(pixels, w, h, 5, out int naiveCount);
        Assert.Equal(naiveCount, count);
        // Same partition and, since both number in raster order of first pixel, the same numbers.
        Assert.Equal(naive, labels);
        int area = 0;
        for (int c = 1; c <= count; c++)
        {
            area += boxes[c].Area;
        }
        Assert.Equal(pixels.Count(p => p > 5), area);
    }

    private static int[] FloodFill(ushort[] pixels, int w, int h, int t, out int count)
    {
        var labels = new int[w * h];
        count = 0;
        var stack = new Stack<int>();
        for (int start = 0; start < labels.Length; start++)
        {
            if (pixels[start] <= t || labels[start] != 0)
            {
                continue;
            }
            labels[start] = ++count;
            stack.Push(start);
            while (stack.Count > 0)
            {
                int p = stack.Pop();
                int x = p % w, y = p / w;
                for (int dy = -1; dy <= 1; dy++)
                {
                    for (int dx = -1; dx <= 1; dx++)
                    {
                        int nx = x + dx, ny = y + dy;
                        if (nx < 0 || ny < 0 || nx >= w || ny >= h)
                        {
                            continue;
                        }
                        int q = ny * w + nx;
                        if (pixels[q] > t && labels[q] == 0)
                        {
                            labels[q] = count;
                            stack.Push(q);
                        }
                    }
                }
            }
        }
        return labels;
    }
}
