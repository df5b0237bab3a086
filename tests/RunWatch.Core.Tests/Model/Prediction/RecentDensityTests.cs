using RunWatch.Core.Model.Prediction;
using Xunit;

namespace RunWatch.Core.Tests.Model.Prediction;

public sealed class RecentDensityTests
{
    private static WaferDensity W(int day, double density) => new($"W-{day}", new DateTimeOffset(2026, 3, day, 0, 0, 0, TimeSpan.Zero), density);

    [Fact]
    public void Median_TakesMostRecentWafersOnly()
    {
        // DERIVED by hand: the three newest are days 5, 4, 3 → densities 3e8, 9e8, 2e8 → median 3e8; the two newest (3e8, 9e8) → 6e8.
        WaferDensity[] history = [W(1, 1e7), W(3, 2e8), W(5, 3e8), W(2, 1e7), W(4, 9e8)];
        Assert.Equal(3e8, RecentDensity.Median(history, 3));
        Assert.Equal(6e8, RecentDensity.Median(history, 2));
    }

    [Fact]
    public void Median_SkipsUnusableAndThrowsWhenNoneLeft()
    {
        Assert.Equal(2e8, RecentDensity.Median([W(1, 2e8), W(2, double.NaN), W(3, 0)], 5));
        Assert.Throws<InvalidOperationException>(() => RecentDensity.Median([W(1, double.NaN)]));
    }
}
