namespace RunWatch.Core.Thermal;

/// <summary>An interval of the growth window that the record does not cover (times in seconds from the record's origin).</summary>
/// <param name="StartS">Start of the uncovered interval.</param>
/// <param name="EndS">End of the uncovered interval.</param>
public readonly record struct RecordGap(double StartS, double EndS)
{
    /// <summary>Length of the gap in seconds.</summary>
    public double DurationS => EndS - StartS;
}
