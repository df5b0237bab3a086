namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Finds an instrument information strip at the bottom or the top of a field: the run of rows, counted from that end,
/// whose most frequent value covers at least <see cref="UniformFraction"/> of the row. Rendered strips are flat
/// graphics with text; image rows carry noise and never are. A run taller than <see cref="MaxFraction"/> of the
/// image is not taken as a strip (a saturated image would look uniform everywhere).
/// </summary>
internal static class InfoStripDetector
{
    public const double UniformFraction = 0.5;

    public const double MaxFraction = 0.25;

    /// <summary>Rows at the bottom that form the strip, 0 when there is none.</summary>
    public static int DetectBottomRows(ReadOnlySpan<ushort> pixels, int width, int height) => Detect(pixels, width, height, fromTop: false);

    /// <summary>Rows at the top that form the strip, 0 when there is none (instruments put it at either end).</summary>
    public static int DetectTopRows(ReadOnlySpan<ushort> pixels, int width, int height) => Detect(pixels, width, height, fromTop: true);

    private static int Detect(ReadOnlySpan<ushort> pixels, int width, int height, bool fromTop)
    {
        if (height < 8)
        {
            return 0;
        }
        var counts = new int[ushort.MaxValue + 1];
        int limit = (int)(height * MaxFraction);
        int rows = 0;
        for (int step = 0; step < height; step++)
        {
            int y = fromTop ? step : height - 1 - step;
            ReadOnlySpan<ushort> row = pixels.Slice(y * width, width);
            int best = 0;
            for (int x = 0; x < row.Length; x++)
            {
                int c = ++counts[row[x]];
                if (c > best)
                {
                    best = c;
                }
            }
            for (int x = 0; x < row.Length; x++)
            {
                counts[row[x]] = 0;
            }
            if (best < UniformFraction * width)
            {
                break;
            }
            rows++;
            if (rows > limit)
            {
                return 0;
            }
        }
        // A strip thinner than 2 rows is a border line, not an information strip, and harms nothing.
        return rows >= 2 ? rows : 0;
    }
}
