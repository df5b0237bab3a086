using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Measurement;
using Xunit;

namespace RunWatch.Imaging.Tests.Analysis;

public sealed class FieldAnalysisOptionsTests
{
    [Fact]
    public void Validate_Defaults_Pass() => new FieldAnalysisOptions().Validate();

    public static TheoryData<FieldAnalysisOptions> Invalid() =>
    [
        new FieldAnalysisOptions { PixelSizeNm = 0 },
        new FieldAnalysisOptions { DiffusionLengthNm = double.NaN },
        new FieldAnalysisOptions { DiffusionLengthPixels = -1 },
        new FieldAnalysisOptions { ManualThreshold = 70000 },
        new FieldAnalysisOptions { MinWireAreaPixels = 0 },
        new FieldAnalysisOptions { CompactFactor = 0.5 },
        new FieldAnalysisOptions { ExcludedBottomRows = -2 },
        new FieldAnalysisOptions { DenoiseRadius = 11 },
        new FieldAnalysisOptions { Classification = new ClassificationOptions { MaxAspectRatio = 0.9 } },
        new FieldAnalysisOptions { Classification = new ClassificationOptions { MinSolidity = 1.5 } },
    ];

    [Theory]
    [MemberData(nameof(Invalid))]
    public void Validate_OutOfRange_Throws(FieldAnalysisOptions options) =>
        Assert.ThrowsAny<ArgumentOutOfRangeException>(options.Validate);
}
