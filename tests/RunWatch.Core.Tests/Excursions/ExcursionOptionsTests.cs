using RunWatch.Core.Excursions;
using Xunit;

namespace RunWatch.Core.Tests.Excursions;

public sealed class ExcursionOptionsTests
{
    [Fact]
    public void Validate_Defaults_AreValid()
    {
        Assert.Empty(new ExcursionOptions().Validate());
    }

    public static TheoryData<string, Action<ExcursionOptions>> BadOptions => new()
    {
        { "WarningBandK", o => o.WarningBandK = 0 },
        { "AlarmBandK", o => o.AlarmBandK = 2 },
        { "HysteresisK", o => o.HysteresisK = 5 },
        { "HysteresisK", o => o.HysteresisK = -1 },
        { "MinimumDuration", o => o.MinimumDuration = TimeSpan.FromSeconds(-1) },
        { "HighLimitC", o => { o.HighLimitC = 500; o.LowLimitC = 600; } },
        { "MaxRateKPerS", o => o.MaxRateKPerS = 0 },
        { "RateWindow", o => o.RateWindow = TimeSpan.Zero },
        { "StaleAfter", o => o.StaleAfter = TimeSpan.Zero },
        { "FlatlineWindow", o => o.FlatlineWindow = TimeSpan.FromSeconds(-3) },
        { "FlatlineEpsilonK", o => o.FlatlineEpsilonK = -0.1 },
        { "MaxGap", o => o.MaxGap = TimeSpan.Zero },
    };

    [Theory]
    [MemberData(nameof(BadOptions))]
    public void Validate_BadValue_NamesTheProperty(string property, Action<ExcursionOptions> spoil)
    {
        var options = new ExcursionOptions();
        spoil(options);
        Assert.Contains(options.Validate(), e => e.StartsWith(property, StringComparison.Ordinal));
        Assert.Throws<ArgumentException>(() => new ExcursionMonitor(options));
    }
}
