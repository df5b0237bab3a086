namespace RunWatch.Core.Thermal;

/// <summary>A general piecewise-linear calibration followed by the kelvin conversion.</summary>
internal readonly struct CalibrationMap(TemperatureCalibration calibration) : ITemperatureMap
{
    public double ToKelvin(double readingC) => calibration.ToTrueC(readingC) + PhysicalConstants.ZeroCelsiusK;
}
