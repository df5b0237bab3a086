namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Removes a slowly varying background (charging, detector gradient) by subtracting a grey-scale opening, the
/// flat-structuring-element form of Sternberg's rolling ball (Sternberg, S. R. (1983) "Biomedical image
/// processing", IEEE Computer 16(1), 22–34): objects narrower than the window are removed from the estimate,
/// the substrate is kept. The opening runs on a block-minimum reduced copy (factor <see cref="Reduction"/>) and
/// is smoothed by a box filter before bilinear interpolation back to full size, which keeps it cheap and free of
/// block edges.
/// </summary>
internal static class BackgroundFlattener
{
    public const int Reduction = 4;

    /// <summary>Writes <c>max(0, src − background)</c> into <paramref name="dst"/>; returns the mean background level removed.</summary>
    public static double Flatten(ushort[] src, ushort[] dst, int width, int height, int windowPixels)
    {
        int f = Reduction;
        int cw = (width + f - 1) / f;
        int ch = (height + f - 1) / f;
        var coarse = new float[cw * ch];
        Parallel.For(0, ch, cy =>
        {
            int y0 = cy * f;
            int y1 = Math.Min(height, y0 + f);
            for (int cx = 0; cx < cw; cx++)
            {
                int x0 = cx * f;
                int x1 = Math.Min(width, x0 + f);
                int m = ushort.MaxValue;
                for (int y = y0; y < y1; y++)
                {
                    ReadOnlySpan<ushort> row = src.AsSpan(y * width + x0, x1 - x0);
                    for (int i = 0; i < row.Length; i++)
                    {
                        m = Math.Min(m, row[i]);
                    }
                }
                coarse[cy * cw + cx] = m;
            }
        });
        int r = Math.Max(1, windowPixels / (2 * f));
        SlidingExtremum.Apply2D(coarse, cw, ch, r, max: false);
        SlidingExtremum.Apply2D(coarse, cw, ch, r, max: true);
        BoxBlur.Apply(coarse, cw, ch, r);

        double total = 0;
        for (int i = 0; i < coarse.Length; i++)
        {
            total += coarse[i];
        }

        // Coarse sample k sits at the centre of its block, (k + 0.5)·f − 0.5 in full-size pixels.
        var ix0 = new int[width];
        var ix1 = new int[width];
        var tx = new float[width];
        for (int x = 0; x < width; x++)
        {
            (ix0[x], ix1[x], tx[x]) = Interpolation(x, f, cw);
        }
        Parallel.For(0, BoxBlur.BandCount(height), band =>
        {
            (int ys, int ye) = BoxBlur.Band(band, height);
            var line = new float[cw];
            for (int y = ys; y < ye; y++)
            {
                (int iy0, int iy1, float ty) = Interpolation(y, f, ch);
                ReadOnlySpan<float> top = coarse.AsSpan(iy0 * cw, cw);
                ReadOnlySpan<float> bottom = coarse.AsSpan(iy1 * cw, cw);
                for (int cx = 0; cx < cw; cx++)
                {
                    line[cx] = top[cx] + (bottom[cx] - top[cx]) * ty;
                }
                ReadOnlySpan<ushort> srow = src.AsSpan(y * width, width);
                Span<ushort> drow = dst.AsSpan(y * width, width);
                for (int x = 0; x < width; x++)
                {
                    float bg = line[ix0[x]] + (line[ix1[x]] - line[ix0[x]]) * tx[x];
                    float v = srow[x] - bg;
                    drow[x] = v <= 0 ? (ushort)0 : (ushort)(v + 0.5f);
                }
            }
        });
        return total / coarse.Length;
    }

    private static (int Lower, int Upper, float Weight) Interpolation(int i, int f, int coarseLength)
    {
        float g = Math.Clamp((i + 0.5f) / f - 0.5f, 0, coarseLength - 1);
        int lower = Math.Min((int)g, Math.Max(0, coarseLength - 2));
        int upper = Math.Min(lower + 1, coarseLength - 1);
        return (lower, upper, coarseLength > 1 ? g - lower : 0);
    }
}
