namespace RunWatch.Imaging.Scale;

/// <summary>
/// Puts the strip's scale bar beside the configured pixel size. Instruments draw bars at round lengths (1, 2 or 5 ×
/// 10ⁿ nm; COMMON PRACTICE, no source), so a bar that comes out far from every round length at the configured scale
/// suggests a wrong pixel size. The number printed on the bar is not read.
/// </summary>
internal static class ScaleBarCheck
{
    /// <summary>Relative distance to the nearest round length above which the caution is given.</summary>
    public const double Tolerance = 0.04;

    public static void AddNote(List<string> notes, int? barPixels, FieldScale scale)
    {
        if (barPixels is not { } px)
        {
            return;
        }
        if (scale.PixelSizeNm is not { } nm)
        {
            notes.Add($"the information strip holds a scale bar of {px} px; with no pixel size configured, compare it with the length printed on it ({px} px = that length)");
            return;
        }
        double length = px * nm;
        double round = NearestRound(length);
        string text = $"the information strip's scale bar is {px} px long: {length:0.#} nm at the configured {nm:0.###} nm/px";
        notes.Add(Math.Abs(length / round - 1) > Tolerance
            ? text + $"; scale bars are drawn at round lengths and the nearest is {round:0.#} nm — check the pixel size against the number printed on the bar"
            : text + $" (a round length: consistent with the configured scale)");
    }

    /// <summary>The nearest of 1, 2, 5 × 10ⁿ to <paramref name="length"/> in ratio.</summary>
    public static double NearestRound(double length)
    {
        double decade = Math.Pow(10, Math.Floor(Math.Log10(length)));
        double best = decade, bestRatio = double.PositiveInfinity;
        foreach (double m in new[] { 1.0, 2.0, 5.0, 10.0 })
        {
            double ratio = Math.Abs(Math.Log(length / (m * decade)));
            if (ratio < bestRatio)
            {
                bestRatio = ratio;
                best = m * decade;
            }
        }
        return best;
    }
}
