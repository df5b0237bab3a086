using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class TemperatureCalibrationTests
{
    [Fact]
    public void Identity_ChangesNothing()
    {
        Assert.True(TemperatureCalibration.Identity.IsIdentity);
        Assert.Equal(612.3, TemperatureCalibration.Identity.ToTrueC(612.3));
    }

    [Fact]
    public void FromReference_OxideDesorption_ShiftsWholeLog()
    {
        // CONFIRMED (CHECKS §9): GaAs native-oxide desorption ≈ 580 °C; observed at a reading of 560 °C → +20 K everywhere.
        var calibration = TemperatureCalibration.FromReference(560, 580);
        Assert.Equal(580.0, calibration.ToTrueC(560), 1e-12);
        Assert.Equal(220.0, calibration.ToTrueC(200), 1e-12);
        Assert.Equal(640.0, calibration.ToTrueC(620), 1e-12);
    }

    [Fact]
    public void TwoOrMorePoints_InterpolateAndExtendEndSegments()
    {
        // Reference points: Al freezing 660.323 °C read as 650; oxide desorption 580 °C read as 560 (invented readings).
        var calibration = new TemperatureCalibration([new CalibrationPoint(650, 660.323), new CalibrationPoint(560, 580), new CalibrationPoint(400, 415)]);
        Assert.Equal(580.0, calibration.ToTrueC(560), 1e-12);
        Assert.Equal(660.323, calibration.ToTrueC(650), 1e-12);
        Assert.Equal(580 + (605 - 560) * (80.323 / 90), calibration.ToTrueC(605), 1e-12);
        Assert.Equal(415 + (480 - 400) * (165.0 / 160), calibration.ToTrueC(480), 1e-12);
        Assert.Equal(660.323 + 10 * (80.323 / 90), calibration.ToTrueC(660), 1e-12);
        Assert.Equal(415 - 100 * (165.0 / 160), calibration.ToTrueC(300), 1e-12);
    }

    [Fact]
    public void ToTrueC_Span_MatchesScalar()
    {
        var calibration = new TemperatureCalibration([new CalibrationPoint(500, 510), new CalibrationPoint(600, 615)]);
        double[] readings = [450, 500, 550, 600, 650];
        var result = new double[readings.Length];
        calibration.ToTrueC(readings, result);
        for (int i = 0; i < readings.Length; i++)
        {
            Assert.Equal(calibration.ToTrueC(readings[i]), result[i]);
        }
    }

    [Fact]
    public void Constructor_DuplicateOrNonFinitePoints_Throws()
    {
        Assert.Throws<ArgumentException>(() => new TemperatureCalibration([new CalibrationPoint(500, 510), new CalibrationPoint(500, 520)]));
        Assert.Throws<ArgumentException>(() => new TemperatureCalibration([new CalibrationPoint(double.NaN, 510)]));
    }
}
