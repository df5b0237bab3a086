using Xunit;
using RunWatch.Core.Safety;

namespace RunWatch.Core.Tests.Safety;

public sealed class ExposureLimitTableTests
{
    [Fact]
    public void All_EveryLimit_HasSourceYearAndAveragingTime()
    {
        Assert.NotEmpty(ExposureLimitTable.All);
        foreach (var limit in ExposureLimitTable.All)
        {
            Assert.False(string.IsNullOrWhiteSpace(limit.Source), limit.Substance);
            Assert.Matches(@"\d{4}", limit.Year);
            Assert.Contains(limit.Averaging, new[] { "8-h TWA", "ceiling, 15 min", "IDLH" });
            Assert.Contains(limit.Unit, new[] { "ppm", "mg/m³" });
        }
    }

    [Theory]
    // CONFIRMED: CHECKS table of safety facts, from NIOSH IDLH documentation for arsine (7784-42-1) and
    // inorganic arsenic (7440-38-2), both 1994, and the NIOSH Pocket Guide entry npgd0040.
    [InlineData("Arsine", "OSHA", "PEL", 0.05, "ppm")]
    [InlineData("Arsine", "NIOSH", "REL", 0.002, "mg/m³")]
    [InlineData("Arsine", "NIOSH", "IDLH", 3, "ppm")]
    [InlineData("Inorganic arsenic (as As)", "OSHA", "PEL", 0.010, "mg/m³")]
    [InlineData("Inorganic arsenic (as As)", "OSHA", "action level", 0.005, "mg/m³")]
    [InlineData("Inorganic arsenic (as As)", "NIOSH", "IDLH", 5, "mg/m³")]
    public void All_PublishedValue_IsAsConfirmed(string substance, string body, string kind, double value, string unit)
    {
        var limit = Assert.Single(ExposureLimitTable.All, l => l.Substance == substance && l.Body == body && l.Kind == kind);
        Assert.Equal(value, limit.Value, 6);
        Assert.Equal(unit, limit.Unit);
    }

    [Fact]
    public void Disclaimer_NamesInterlocksProceduresAndCodes()
    {
        Assert.Contains("hardware interlocks", ExposureLimitTable.Disclaimer, StringComparison.Ordinal);
        Assert.Contains("procedures", ExposureLimitTable.Disclaimer, StringComparison.Ordinal);
        Assert.Contains("codes and regulations", ExposureLimitTable.Disclaimer, StringComparison.Ordinal);
    }
}
