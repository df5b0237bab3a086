namespace RunWatch.Core.Model.Prediction;

/// <summary>
/// The process's recent nucleation density for a prediction: the median of the last <c>count</c> wafers' measured
/// densities (the median, so one odd wafer does not move the prediction).
/// </summary>
public static class RecentDensity
{
    /// <summary>The median density (cm⁻²) of the most recent <paramref name="count"/> wafers with a positive finite density.</summary>
    /// <exception cref="InvalidOperationException">No wafer has a usable density.</exception>
    public static double Median(IReadOnlyList<WaferDensity> history, int count = 5)
    {
        ArgumentNullException.ThrowIfNull(history);
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 1);
        double[] recent = history
            .Where(w => double.IsFinite(w.DensityPerCm2) && w.DensityPerCm2 > 0)
            .OrderByDescending(w => w.GrownAt)
            .Take(count)
            .Select(w => w.DensityPerCm2)
            .OrderBy(d => d)
            .ToArray();
        if (recent.Length == 0)
        {
            throw new InvalidOperationException("No past wafer of this process has a measured density; a prediction needs one.");
        }
        int mid = recent.Length / 2;
        return recent.Length % 2 == 1 ? recent[mid] : (recent[mid - 1] + recent[mid]) / 2;
    }
}
