namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Running minimum or maximum over a window of 2r+1 samples (truncated at the ends) with a monotonic queue:
/// amortised O(1) per sample, the 1-D step of a separable flat square erosion or dilation.
/// </summary>
internal static class SlidingExtremum
{
    public static void Run(ReadOnlySpan<float> src, Span<float> dst, int r, bool max, Span<int> queue)
    {
        int n = src.Length;
        int head = 0;
        int tail = 0;
        int next = 0;
        for (int i = 0; i < n; i++)
        {
            int hi = Math.Min(n - 1, i + r);
            while (next <= hi)
            {
                float v = src[next];
                while (tail > head && (max ? src[queue[tail - 1]] <= v : src[queue[tail - 1]] >= v))
                {
                    tail--;
                }
                queue[tail++] = next;
                next++;
            }
            while (queue[head] < i - r)
            {
                head++;
            }
            dst[i] = src[queue[head]];
        }
    }

    /// <summary>Separable flat (2r+1)² erosion (<paramref name="max"/> false) or dilation of a small float image, in place.</summary>
    public static void Apply2D(float[] data, int width, int height, int r, bool max)
    {
        int n = Math.Max(width, height);
        var line = new float[n];
        var outLine = new float[n];
        var queue = new int[n];
        for (int y = 0; y < height; y++)
        {
            Span<float> row = data.AsSpan(y * width, width);
            row.CopyTo(line);
            Run(line.AsSpan(0, width), outLine.AsSpan(0, width), r, max, queue);
            outLine.AsSpan(0, width).CopyTo(row);
        }
        for (int x = 0; x < width; x++)
        {
            for (int y = 0; y < height; y++)
            {
                line[y] = data[y * width + x];
            }
            Run(line.AsSpan(0, height), outLine.AsSpan(0, height), r, max, queue);
            for (int y = 0; y < height; y++)
            {
                data[y * width + x] = outLine[y];
            }
        }
    }
}
