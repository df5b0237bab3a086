using Xunit;
using RunWatch.Core.Safety;

namespace RunWatch.Core.Tests.Safety;

public sealed class GasConcentrationTests
{
    [Fact]
    public void PpmToMilligramsPerCubicMetre_ArsineOnePpm_Is3Point19()
    {
        // CONFIRMED: NIOSH Pocket Guide entry npgd0040 (arsine) gives 1 ppm = 3.19 mg/m³.
        double mg = GasConcentration.PpmToMilligramsPerCubicMetre(1, ExposureLimitTable.ArsineMolarMass);
        Assert.Equal(3.19, mg, 2);
    }

    [Fact]
    public void PpmToMilligramsPerCubicMetre_ArsineTlv1993_Is0Point16()
    {
        // CONFIRMED: NIOSH IDLH documentation for arsine (1994) lists the 1993–94 ACGIH TLV as 0.05 ppm (0.16 mg/m³).
        double mg = GasConcentration.PpmToMilligramsPerCubicMetre(0.05, ExposureLimitTable.ArsineMolarMass);
        Assert.Equal(0.16, mg, 2);
    }

    [Fact]
    public void MilligramsPerCubicMetreToPpm_RoundTrip_ReturnsInput()
    {
        // DERIVED: the two conversions are inverses by construction of M/24.45.
        double ppm = GasConcentration.MilligramsPerCubicMetreToPpm(GasConcentration.PpmToMilligramsPerCubicMetre(2.5, 34.08), 34.08);
        Assert.Equal(2.5, ppm, 12);
    }

    [Fact]
    public void PpmToMilligramsPerCubicMetre_NonPositiveMolarMass_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => GasConcentration.PpmToMilligramsPerCubicMetre(1, 0));
    }
}
