namespace RunWatch.Core.Thermal;

/// <summary>A calibration that is one constant offset (identity included): T[K] = reading + offset + 273.15.</summary>
internal readonly struct OffsetMap(double offsetToKelvin) : ITemperatureMap
{
    public double ToKelvin(double readingC) => readingC + offsetToKelvin;
}
