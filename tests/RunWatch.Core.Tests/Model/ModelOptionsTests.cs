using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class ModelOptionsTests
{
    [Fact]
    public void Defaults_AreValid()
    {
        new CalibrationOptions().Validate();
        new NucleationFieldOptions().Validate();
        PowerLawFitOptions.Default.Validate();
    }

    public static TheoryData<CalibrationOptions> BadCalibrationOptions() => new()
    {
        new CalibrationOptions { MinCaptureRadiusNm = 0 },
        new CalibrationOptions { MinCaptureRadiusNm = 500, MaxCaptureRadiusNm = 400 },
        new CalibrationOptions { MaxCaptureRadiusNm = double.PositiveInfinity },
        new CalibrationOptions { ScanPoints = 2 },
        new CalibrationOptions { SearchModel = (RadiusModelKind)9 },
    };

    [Theory]
    [MemberData(nameof(BadCalibrationOptions))]
    public void CalibrationOptions_OutOfRange_Throws(CalibrationOptions options)
    {
        Assert.Throws<ArgumentException>(options.Validate);
    }

    [Fact]
    public void NucleationFieldOptions_OutOfRange_Throws()
    {
        Assert.Throws<ArgumentException>(new NucleationFieldOptions { FieldWidthNm = 0 }.Validate);
        Assert.Throws<ArgumentException>(new NucleationFieldOptions { FieldHeightNm = double.NaN }.Validate);
        Assert.Throws<ArgumentException>(new NucleationFieldOptions { Process = NucleationSiteProcess.HardCore }.Validate);
    }

    [Fact]
    public void PowerLawFitOptions_OutOfRange_Throws()
    {
        Assert.Throws<ArgumentException>(new PowerLawFitOptions { MaxIterations = 0 }.Validate);
        Assert.Throws<ArgumentException>(new PowerLawFitOptions { RelativeStepTolerance = -1 }.Validate);
        Assert.Throws<ArgumentException>(() => RadiusModelFitter.FitPowerLaw([0.1, 0.2, 0.3], [1, 2, 3], new PowerLawFitOptions { MaxIterations = 0 }));
    }
}
