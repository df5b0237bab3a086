namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Measures the scale bar drawn in an information strip: the longest straight horizontal run of ink (pixels far
/// from the strip's fill level, on the same side as the text) that stays the same for at least 2 and at most a
/// fifth of the strip's rows (text glyphs are short runs, a logo is a tall block, a separator spans the whole width).
/// Only the bar's length in pixels is read, not the number printed beside it.
/// </summary>
internal static class ScaleBarDetector
{
    /// <summary>The bar's length in pixels, or null when the strip holds none.</summary>
    public static int? Measure(ReadOnlySpan<ushort> pixels, int width, int firstRow, int rows)
    {
        if (rows < 4 || width < 40)
        {
            return null;
        }
        // Fill level: the strip's most frequent value; ink: the far side of the midpoint to the strip's extreme.
        var counts = new Dictionary<ushort, int>();
        ushort min = ushort.MaxValue, max = 0;
        for (int y = firstRow; y < firstRow + rows; y++)
        {
            foreach (ushort v in pixels.Slice(y * width, width))
            {
                counts[v] = counts.GetValueOrDefault(v) + 1;
                min = Math.Min(min, v);
                max = Math.Max(max, v);
            }
        }
        ushort fill = counts.MaxBy(c => c.Value).Key;
        bool brightInk = max - fill >= fill - min;
        int cut = brightInk ? (fill + max) / 2 : (fill + min) / 2;
        int maxThickness = Math.Max(2, rows / 5);
        int best = 0;
        int runStart = -1, runEnd = -1, thickness = 0;
        for (int y = firstRow; y < firstRow + rows; y++)
        {
            (int start, int end) = LongestRun(pixels.Slice(y * width, width), cut, brightInk);
            int length = end - start;
            if (length >= 12 && length < 0.9 * width && Math.Abs(start - runStart) <= 1 && Math.Abs(end - runEnd) <= 1)
            {
                thickness++;
            }
            else
            {
                Close();
                runStart = start;
                runEnd = end;
                thickness = length >= 12 && length < 0.9 * width ? 1 : 0;
            }
        }
        Close();
        return best > 0 ? best : null;

        void Close()
        {
            if (thickness >= 2 && thickness <= maxThickness)
            {
                best = Math.Max(best, runEnd - runStart);
            }
        }
    }

    private static (int Start, int End) LongestRun(ReadOnlySpan<ushort> row, int cut, bool brightInk)
    {
        int bestStart = 0, bestEnd = 0, start = -1;
        for (int x = 0; x <= row.Length; x++)
        {
            bool ink = x < row.Length && (brightInk ? row[x] > cut : row[x] < cut);
            if (ink && start < 0)
            {
                start = x;
            }
            else if (!ink && start >= 0)
            {
                if (x - start > bestEnd - bestStart)
                {
                    (bestStart, bestEnd) = (start, x);
                }
                start = -1;
            }
        }
        return (bestStart, bestEnd);
    }
}
