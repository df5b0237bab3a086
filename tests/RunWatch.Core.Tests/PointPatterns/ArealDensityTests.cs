using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.PointPatterns;

public sealed class ArealDensityTests
{
    [Fact]
    public void PerSquareCentimetre_OnePerSquareMicrometre_IsOneE8()
    {
        // DERIVED (CHECKS.md §9): 1 cm = 1e4 µm.
        Assert.Equal(1e8, ArealDensity.PerSquareCentimetre(1.0));
        Assert.Equal(1.0, ArealDensity.PerSquareMicrometre(1e8));
    }

    [Theory]
    [InlineData(0.2, 2.5e9)]
    [InlineData(2.0, 2.5e7)]
    public void SquareLattice_HoleArrayPitch_MatchesQuotedDensity(double pitchUm, double perCm2)
    {
        // CONFIRMED (CHECKS.md §9): Bauer et al. (2010) hole arrays, pitch 200 nm–2 µm ⇒ 2.5e9–2.5e7 cm⁻² (square).
        Assert.Equal(perCm2, ArealDensity.PerSquareCentimetre(ArealDensity.SquareLattice(pitchUm)), perCm2 * 1e-12);
    }

    [Fact]
    public void TriangularLattice_PitchOneMicrometre_Is1Point1547E8()
    {
        // DERIVED (CHECKS.md §9): 2/√3 = 1.1547.
        Assert.Equal(1.1547e8, ArealDensity.PerSquareCentimetre(ArealDensity.TriangularLattice(1.0)), 1e4);
    }
}
