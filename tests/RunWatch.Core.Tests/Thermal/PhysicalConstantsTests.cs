using Xunit;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Tests.Thermal;

public sealed class PhysicalConstantsTests
{
    [Fact]
    public void DefiningConstants_AreTheExactSiValues()
    {
        // CONFIRMED (secondary): SI Brochure 9th ed. (BIPM 2019), CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021).
        Assert.Equal(1.380649e-23, PhysicalConstants.BoltzmannJPerK);
        Assert.Equal(1.602176634e-19, PhysicalConstants.ElementaryChargeC);
    }

    [Fact]
    public void BoltzmannEvPerK_MatchesCodata2018()
    {
        // CONFIRMED (secondary): CODATA 2018 / 2019 SI, kB = 8.617333262...e-5 eV/K (exact quotient of two exact constants).
        Assert.Equal(8.617333262e-5, PhysicalConstants.BoltzmannEvPerK, 8.617333262e-5 * 1e-9);
        // DERIVED: exact rational value 8.61733326214517743...e-5 (CHECKS §1), to double precision.
        Assert.Equal(8.6173332621451774e-5, PhysicalConstants.BoltzmannEvPerK, 1e-19);
    }

    [Fact]
    public void BoltzmannEvPerK_IsNotTheCodata2014Value()
    {
        // CONFIRMED (secondary): CODATA 2014 gave 8.6173303(50)e-5 eV/K; it differs from the 2019 SI value by 3.5e-7 relative.
        const double codata2014 = 8.6173303e-5;
        double relative = Math.Abs(PhysicalConstants.BoltzmannEvPerK / codata2014 - 1);
        Assert.True(relative > 3e-7, $"relative difference {relative} is too small: the 2014 value would be accepted");
    }

    [Fact]
    public void CelsiusToKelvin_UsesIts90IcePoint()
    {
        // CONFIRMED: ITS-90 (Preston-Thomas, Metrologia 27, 3-10, 1990), t/°C = T/K − 273.15.
        Assert.Equal(273.15, PhysicalConstants.ZeroCelsiusK);
        Assert.Equal(873.15, PhysicalConstants.CelsiusToKelvin(600), 1e-12);
    }

    [Theory]
    [InlineData(29.7646, 302.9146)] // Ga melting point
    [InlineData(156.5985, 429.7485)] // In freezing point
    [InlineData(419.527, 692.677)] // Zn freezing point
    [InlineData(660.323, 933.473)] // Al freezing point
    public void CelsiusKelvin_Its90FixedPoints_RoundTrip(double celsius, double kelvin)
    {
        // CONFIRMED: ITS-90 Table 1 (stored text at its-90.com/table1.html).
        Assert.Equal(kelvin, PhysicalConstants.CelsiusToKelvin(celsius), 1e-9);
        Assert.Equal(celsius, PhysicalConstants.KelvinToCelsius(kelvin), 1e-9);
        double roundTrip = PhysicalConstants.KelvinToCelsius(PhysicalConstants.CelsiusToKelvin(celsius));
        double ulpOfKelvin = Math.BitIncrement(kelvin) - kelvin;
        Assert.True(Math.Abs(roundTrip - celsius) <= ulpOfKelvin, $"{roundTrip} vs {celsius}");
    }
}
