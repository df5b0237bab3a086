namespace RunWatch.Core.Thermal;

/// <summary>The integral ∫D dt over the covered part of a window, with the coverage bookkeeping.</summary>
/// <param name="IntegralCmSq">∫D(T(t)) dt over the covered time, in cm².</param>
/// <param name="CoveredS">Time of the window covered by integrated segments, in s.</param>
/// <param name="WindowS">Length of the window, in s.</param>
/// <param name="GapCount">Number of uncovered intervals longer than the gap limit.</param>
/// <param name="LongestGapS">The longest uncovered interval in s (0 when none).</param>
public readonly record struct IntegrationResult(double IntegralCmSq, double CoveredS, double WindowS, int GapCount, double LongestGapS)
{
    /// <summary>Covered fraction of the window in percent (0 for an empty window).</summary>
    public double CoveragePercent => WindowS > 0 ? 100 * CoveredS / WindowS : 0;

    /// <summary>True when no uncovered interval exceeds the gap limit.</summary>
    public bool IsComplete => GapCount == 0;
}
