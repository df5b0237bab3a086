namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Light denoising: the separable 5-tap kernel [1 2 3 2 1]/9 in each direction, which equals a 3 × 3 box filter
/// applied twice (a small, nearly Gaussian blur, σ ≈ 1.15 px). Edges replicate. Runs in place with a ring of
/// five filtered rows per band of rows, so it needs no second image; integer arithmetic with constant divisors.
/// </summary>
internal static class TriangleSmoothing
{
    public static void Apply(ushort[] image, int width, int height)
    {
        if (height < 1 || width < 1)
        {
            return;
        }
        // Bands are processed independently; each needs the two unfiltered rows above and below it, copied first.
        int bands = BoxBlur.BandCount(height);
        var halo = new ushort[bands][];
        for (int b = 0; b < bands; b++)
        {
            (int y0, int y1) = BoxBlur.Band(b, height);
            halo[b] = new ushort[4 * width];
            for (int k = 0; k < 2; k++)
            {
                image.AsSpan(Math.Max(0, y0 - 2 + k) * width, width).CopyTo(halo[b].AsSpan(k * width, width));
                image.AsSpan(Math.Min(height - 1, y1 + k) * width, width).CopyTo(halo[b].AsSpan((2 + k) * width, width));
            }
        }
        Parallel.For(0, bands, b =>
        {
            (int y0, int y1) = BoxBlur.Band(b, height);
            var ring = new int[5 * width];
            var source = new ushort[width];
            ReadOnlySpan<ushort> Row(int y)
            {
                if (y < y0)
                {
                    return halo[b].AsSpan((y - (y0 - 2)) * width, width);
                }
                if (y >= y1)
                {
                    return halo[b].AsSpan((2 + y - y1) * width, width);
                }
                return image.AsSpan(y * width, width);
            }
            int Clamp(int y) => Math.Clamp(y, 0, height - 1);
            // Prime the ring with rows y0-2 .. y0+1 (horizontal pass only).
            for (int y = y0 - 2; y <= y0 + 1; y++)
            {
                Horizontal(RowOf(Clamp(y)), ring.AsSpan(Slot(y) * width, width));
            }
            for (int y = y0; y < y1; y++)
            {
                Horizontal(RowOf(Clamp(y + 2)), ring.AsSpan(Slot(y + 2) * width, width));
                ReadOnlySpan<int> a = ring.AsSpan(Slot(y - 2) * width, width);
                ReadOnlySpan<int> bb = ring.AsSpan(Slot(y - 1) * width, width);
                ReadOnlySpan<int> c = ring.AsSpan(Slot(y) * width, width);
                ReadOnlySpan<int> d = ring.AsSpan(Slot(y + 1) * width, width);
                ReadOnlySpan<int> e = ring.AsSpan(Slot(y + 2) * width, width);
                Span<ushort> output = image.AsSpan(y * width, width);
                for (int x = 0; x < width; x++)
                {
                    int v = a[x] + 2 * bb[x] + 3 * c[x] + 2 * d[x] + e[x];
                    output[x] = (ushort)((v + 40) / 81);
                }
            }

            ReadOnlySpan<ushort> RowOf(int y)
            {
                // Rows of this band are overwritten as we go; the ring holds their horizontal pass before that.
                Row(y).CopyTo(source);
                return source;
            }
        });
    }

    private static int Slot(int y) => ((y % 5) + 5) % 5;

    private static void Horizontal(ReadOnlySpan<ushort> row, Span<int> output)
    {
        int n = row.Length;
        if (n < 5)
        {
            for (int x = 0; x < n; x++)
            {
                output[x] = row[Math.Clamp(x - 2, 0, n - 1)] + 2 * row[Math.Clamp(x - 1, 0, n - 1)] + 3 * row[x]
                    + 2 * row[Math.Clamp(x + 1, 0, n - 1)] + row[Math.Clamp(x + 2, 0, n - 1)];
            }
            return;
        }
        output[0] = 6 * row[0] + 2 * row[1] + row[2];
        output[1] = 3 * row[0] + 3 * row[1] + 2 * row[2] + row[3];
        for (int x = 2; x < n - 2; x++)
        {
            output[x] = row[x - 2] + 2 * row[x - 1] + 3 * row[x] + 2 * row[x + 1] + row[x + 2];
        }
        output[n - 2] = row[n - 4] + 2 * row[n - 3] + 3 * row[n - 2] + 3 * row[n - 1];
        output[n - 1] = row[n - 3] + 2 * row[n - 2] + 6 * row[n - 1];
    }
}
