namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Separable box (moving-average) filter with edge replication, by running sums: O(1) work per pixel whatever
/// the radius. Rows are split into bands across threads; columns likewise for the vertical pass.
/// </summary>
internal static class BoxBlur
{
    /// <summary>Filters <paramref name="src"/> into <paramref name="dst"/> with a (2r+1)² box; <paramref name="temp"/> holds the horizontal pass.</summary>
    public static void Apply(ushort[] src, ushort[] dst, ushort[] temp, int width, int height, int radius)
    {
        if (radius <= 0)
        {
            Array.Copy(src, dst, (long)width * height);
            return;
        }
        Parallel.For(0, BandCount(height), band =>
        {
            (int y0, int y1) = Band(band, height);
            for (int y = y0; y < y1; y++)
            {
                HorizontalRow(src.AsSpan(y * width, width), temp.AsSpan(y * width, width), radius);
            }
        });
        Parallel.For(0, BandCount(width), band =>
        {
            (int x0, int x1) = Band(band, width);
            Vertical(temp, dst, width, height, radius, x0, x1);
        });
    }

    private static void HorizontalRow(ReadOnlySpan<ushort> row, Span<ushort> output, int r)
    {
        int n = row.Length;
        int divisor = 2 * r + 1;
        long sum = 0;
        for (int k = -r; k <= r; k++)
        {
            sum += row[Math.Clamp(k, 0, n - 1)];
        }
        for (int x = 0; x < n; x++)
        {
            output[x] = (ushort)((sum + divisor / 2) / divisor);
            int add = Math.Min(x + r + 1, n - 1);
            int remove = Math.Max(x - r, 0);
            sum += row[add] - row[remove];
        }
    }

    private static void Vertical(ushort[] src, ushort[] dst, int width, int height, int r, int x0, int x1)
    {
        int span = x1 - x0;
        var sums = new long[span];
        int divisor = 2 * r + 1;
        for (int k = -r; k <= r; k++)
        {
            int y = Math.Clamp(k, 0, height - 1);
            ReadOnlySpan<ushort> row = src.AsSpan(y * width + x0, span);
            for (int i = 0; i < span; i++)
            {
                sums[i] += row[i];
            }
        }
        for (int y = 0; y < height; y++)
        {
            Span<ushort> output = dst.AsSpan(y * width + x0, span);
            for (int i = 0; i < span; i++)
            {
                output[i] = (ushort)((sums[i] + divisor / 2) / divisor);
            }
            ReadOnlySpan<ushort> add = src.AsSpan(Math.Min(y + r + 1, height - 1) * width + x0, span);
            ReadOnlySpan<ushort> remove = src.AsSpan(Math.Max(y - r, 0) * width + x0, span);
            for (int i = 0; i < span; i++)
            {
                sums[i] += add[i] - remove[i];
            }
        }
    }

    /// <summary>Box filter for small float images (the coarse background), single-threaded.</summary>
    public static void Apply(float[] data, int width, int height, int radius)
    {
        if (radius <= 0)
        {
            return;
        }
        var line = new float[Math.Max(width, height)];
        var outLine = new float[line.Length];
        for (int y = 0; y < height; y++)
        {
            Span<float> row = data.AsSpan(y * width, width);
            row.CopyTo(line);
            Line(line.AsSpan(0, width), outLine.AsSpan(0, width), radius);
            outLine.AsSpan(0, width).CopyTo(row);
        }
        for (int x = 0; x < width; x++)
        {
            for (int y = 0; y < height; y++)
            {
                line[y] = data[y * width + x];
            }
            Line(line.AsSpan(0, height), outLine.AsSpan(0, height), radius);
            for (int y = 0; y < height; y++)
            {
                data[y * width + x] = outLine[y];
            }
        }
    }

    private static void Line(ReadOnlySpan<float> src, Span<float> dst, int r)
    {
        int n = src.Length;
        double sum = 0;
        for (int k = -r; k <= r; k++)
        {
            sum += src[Math.Clamp(k, 0, n - 1)];
        }
        for (int x = 0; x < n; x++)
        {
            dst[x] = (float)(sum / (2 * r + 1));
            sum += src[Math.Min(x + r + 1, n - 1)] - src[Math.Max(x - r, 0)];
        }
    }

    internal static int BandCount(int length) => Math.Max(1, Math.Min(length / 64, Environment.ProcessorCount * 4));

    internal static (int Start, int End) Band(int band, int length)
    {
        int count = BandCount(length);
        return ((int)((long)length * band / count), (int)((long)length * (band + 1) / count));
    }
}
