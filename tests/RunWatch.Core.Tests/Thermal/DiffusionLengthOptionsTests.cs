using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Thermal;

public sealed class DiffusionLengthOptionsTests
{
    [Fact]
    public void Validate_Defaults_AreValid()
    {
        Assert.Empty(new DiffusionLengthOptions().Validate());
    }

    [Theory]
    [InlineData(0.0, 10.0, "ConventionFactor")]
    [InlineData(-1.0, 10.0, "ConventionFactor")]
    [InlineData(double.NaN, 10.0, "ConventionFactor")]
    [InlineData(1.0, 0.0, "MaxGap")]
    [InlineData(1.0, -5.0, "MaxGap")]
    public void Validate_BadValue_NamesTheProperty(double factor, double maxGapS, string property)
    {
        var options = new DiffusionLengthOptions { ConventionFactor = factor, MaxGap = TimeSpan.FromSeconds(maxGapS) };
        Assert.Contains(options.Validate(), e => e.StartsWith(property, StringComparison.Ordinal));
    }
}
