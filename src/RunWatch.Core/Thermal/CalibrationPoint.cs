namespace RunWatch.Core.Thermal;

/// <summary>
/// One reference point of a temperature calibration: the thermocouple or pyrometer showed
/// <paramref name="ReadingC"/> when the substrate was known to be at <paramref name="TrueC"/>
/// (for example a surface transition observed at a known temperature).
/// </summary>
/// <param name="ReadingC">The instrument reading in °C.</param>
/// <param name="TrueC">The true substrate temperature in °C at that reading.</param>
public readonly record struct CalibrationPoint(double ReadingC, double TrueC);
