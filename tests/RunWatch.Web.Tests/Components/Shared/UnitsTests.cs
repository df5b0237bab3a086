using RunWatch.Web.Components.Shared;
using Xunit;

namespace RunWatch.Web.Tests.Components.Shared;

public sealed class UnitsTests
{
    [Theory]
    // DERIVED: decimal scientific notation by hand.
    [InlineData(2.5e-5, "2.5 × 10⁻⁵")]
    [InlineData(1.3e12, "1.3 × 10¹²")]
    [InlineData(-4e-3, "-4 × 10⁻³")]
    [InlineData(0, "0")]
    [InlineData(double.NaN, "—")]
    public void Scientific_Value_WrittenWithSuperscriptExponent(double value, string expected)
    {
        Assert.Equal(expected, Units.Scientific(value));
    }

    [Fact]
    public void Celsius_MissingValue_StillCarriesUnit()
    {
        Assert.Equal("— °C", Units.Celsius(null));
        Assert.Equal("612.3 °C", Units.Celsius(612.26));
    }
}
