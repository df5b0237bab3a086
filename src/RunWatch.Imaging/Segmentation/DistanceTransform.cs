namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Exact squared Euclidean distance transform with the feature (nearest-pixel) transform, after Felzenszwalb,
/// P. F. &amp; Huttenlocher, D. P. (2012) "Distance transforms of sampled functions", Theory of Computing 8, 415–428:
/// a 1-D nearest-feature pass down each column, then per row the lower envelope of the parabolas
/// (x − q)² + g(q)². Distances are integers (squared pixel units), so results are exact. Features are the
/// non-zero entries of the input. Pixels with no feature anywhere get <see cref="NoFeature"/>.
/// </summary>
internal static class DistanceTransform
{
    public const int NoFeature = -1;

    public const int Infinite = int.MaxValue;

    /// <summary>For each pixel, the row of the nearest feature in the same column (ties: the upper one), or <see cref="NoFeature"/>.</summary>
    public static void ColumnPass(int[] features, int width, int height, int[] nearestRow, bool parallel = true)
    {
        if (parallel)
        {
            Parallel.For(0, BoxBlur.BandCount(width), band =>
            {
                (int x0, int x1) = BoxBlur.Band(band, width);
                ColumnBand(features, width, height, nearestRow, x0, x1, new int[x1 - x0]);
            });
        }
        else
        {
            ColumnBand(features, width, height, nearestRow, 0, width, new int[width]);
        }
    }

    private static void ColumnBand(int[] features, int width, int height, int[] nearestRow, int x0, int x1, int[] lastScratch)
    {
        int span = x1 - x0;
        Span<int> last = lastScratch.AsSpan(0, span);
        last.Fill(NoFeature);
        for (int y = 0; y < height; y++)
        {
            ReadOnlySpan<int> f = features.AsSpan(y * width + x0, span);
            Span<int> n = nearestRow.AsSpan(y * width + x0, span);
            for (int i = 0; i < span; i++)
            {
                if (f[i] != 0)
                {
                    last[i] = y;
                }
                n[i] = last[i];
            }
        }
        last.Fill(NoFeature);
        for (int y = height - 1; y >= 0; y--)
        {
            ReadOnlySpan<int> f = features.AsSpan(y * width + x0, span);
            Span<int> n = nearestRow.AsSpan(y * width + x0, span);
            for (int i = 0; i < span; i++)
            {
                if (f[i] != 0)
                {
                    last[i] = y;
                }
                int below = last[i];
                int above = n[i];
                if (below != NoFeature && (above == NoFeature || below - y < y - above))
                {
                    n[i] = below;
                }
            }
        }
    }

    /// <summary>
    /// The column pass with 16-bit output (rows &lt; 65535; <see cref="NoFeature16"/> for none), half the memory of
    /// <see cref="ColumnPass"/> for whole-image zones.
    /// </summary>
    public static void ColumnPass16(int[] features, int width, int height, ushort[] nearestRow)
    {
        if (height >= NoFeature16)
        {
            throw new ArgumentOutOfRangeException(nameof(height), height, "the 16-bit column pass needs fewer than 65535 rows");
        }
        Parallel.For(0, BoxBlur.BandCount(width), band =>
        {
            (int x0, int x1) = BoxBlur.Band(band, width);
            int span = x1 - x0;
            var last = new int[span];
            Array.Fill(last, NoFeature);
            for (int y = 0; y < height; y++)
            {
                ReadOnlySpan<int> f = features.AsSpan(y * width + x0, span);
                Span<ushort> n = nearestRow.AsSpan(y * width + x0, span);
                for (int i = 0; i < span; i++)
                {
                    if (f[i] != 0)
                    {
                        last[i] = y;
                    }
                    n[i] = last[i] == NoFeature ? NoFeature16 : (ushort)last[i];
                }
            }
            Array.Fill(last, NoFeature);
            for (int y = height - 1; y >= 0; y--)
            {
                ReadOnlySpan<int> f = features.AsSpan(y * width + x0, span);
                Span<ushort> n = nearestRow.AsSpan(y * width + x0, span);
                for (int i = 0; i < span; i++)
                {
                    if (f[i] != 0)
                    {
                        last[i] = y;
                    }
                    int below = last[i];
                    int above = n[i] == NoFeature16 ? NoFeature : n[i];
                    if (below != NoFeature && (above == NoFeature || below - y < y - above))
                    {
                        n[i] = (ushort)below;
                    }
                }
            }
        });
    }

    public const ushort NoFeature16 = ushort.MaxValue;

    /// <summary>Scratch for <see cref="RowPass"/>, one per thread.</summary>
    internal sealed class RowScratch(int width)
    {
        public readonly long[] G = new long[width];
        public readonly int[] V = new int[width];
        public readonly double[] Z = new double[width + 1];
    }

    /// <summary>
    /// Lower envelope along row <paramref name="y"/>: writes squared distances and the column of the nearest
    /// feature (whose row is <c>nearestRowOfRow[column]</c>). Returns false if the row sees no feature at all.
    /// </summary>
    public static bool RowPass(ReadOnlySpan<int> nearestRowOfRow, int y, Span<int> distance2, Span<int> nearestColumn, RowScratch s)
    {
        int w = nearestRowOfRow.Length;
        long[] g = s.G;
        int[] v = s.V;
        double[] z = s.Z;
        int k = -1;
        for (int q = 0; q < w; q++)
        {
            int r = nearestRowOfRow[q];
            if (r == NoFeature)
            {
                continue;
            }
            long dy = y - r;
            g[q] = dy * dy;
            double sq = 0;
            while (k >= 0)
            {
                int p = v[k];
                sq = ((g[q] + (long)q * q) - (g[p] + (long)p * p)) / (2.0 * (q - p));
                if (sq <= z[k])
                {
                    k--;
                }
                else
                {
                    break;
                }
            }
            if (k < 0)
            {
                k = 0;
                v[0] = q;
                z[0] = double.NegativeInfinity;
            }
            else
            {
                k++;
                v[k] = q;
                z[k] = sq;
            }
            z[k + 1] = double.PositiveInfinity;
        }
        if (k < 0)
        {
            distance2.Fill(Infinite);
            nearestColumn.Fill(NoFeature);
            return false;
        }
        int j = 0;
        for (int q = 0; q < w; q++)
        {
            while (z[j + 1] < q)
            {
                j++;
            }
            int p = v[j];
            long dx = q - p;
            distance2[q] = (int)(dx * dx + g[p]);
            nearestColumn[q] = p;
        }
        return true;
    }

    /// <summary>Sequential squared distances for a small patch, with caller-owned scratch (no allocation).</summary>
    public static void ComputeDistance2(int[] features, int width, int height, int[] distance2, int[] nearestRowScratch, RowScratch s, int[] columnScratch)
    {
        ColumnBand(features, width, height, nearestRowScratch, 0, width, columnScratch);
        Span<int> columns = columnScratch.AsSpan(0, width);
        for (int y = 0; y < height; y++)
        {
            RowPass(nearestRowScratch.AsSpan(y * width, width), y, distance2.AsSpan(y * width, width), columns, s);
        }
    }

    /// <summary>
    /// Whole-image transform: squared distance to, and linear index of, the nearest feature for every pixel.
    /// Either output may be empty to skip it.
    /// </summary>
    public static void Compute(int[] features, int width, int height, int[] distance2, int[] nearestIndex, bool parallel = true)
    {
        var nearestRow = new int[features.Length];
        ColumnPass(features, width, height, nearestRow, parallel);
        void Rows(int y0, int y1)
        {
            var s = new RowScratch(width);
            var d = new int[width];
            var c = new int[width];
            for (int y = y0; y < y1; y++)
            {
                ReadOnlySpan<int> rowNear = nearestRow.AsSpan(y * width, width);
                RowPass(rowNear, y, d, c, s);
                if (distance2.Length > 0)
                {
                    d.CopyTo(distance2.AsSpan(y * width, width));
                }
                if (nearestIndex.Length > 0)
                {
                    Span<int> outRow = nearestIndex.AsSpan(y * width, width);
                    for (int x = 0; x < width; x++)
                    {
                        outRow[x] = c[x] == NoFeature ? NoFeature : rowNear[c[x]] * width + c[x];
                    }
                }
            }
        }
        if (parallel)
        {
            Parallel.For(0, BoxBlur.BandCount(height), band =>
            {
                (int y0, int y1) = BoxBlur.Band(band, height);
                Rows(y0, y1);
            });
        }
        else
        {
            Rows(0, height);
        }
    }
}
