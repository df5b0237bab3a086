namespace RunWatch.Core.Thermal;

/// <summary>The growth window (shutter open) in seconds from the record's origin.</summary>
/// <param name="StartS">Window start.</param>
/// <param name="EndS">Window end (≥ start).</param>
public readonly record struct GrowthWindow(double StartS, double EndS)
{
    /// <summary>Window length in s.</summary>
    public double DurationS => EndS - StartS;
}
