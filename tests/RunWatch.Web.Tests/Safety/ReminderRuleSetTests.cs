using RunWatch.Core.Safety;
using RunWatch.Web.Safety;
using Xunit;

namespace RunWatch.Web.Tests.Safety;

public sealed class ReminderRuleSetTests
{
    [Fact]
    public void WithThresholds_Configured_ReplacesOnlyThatDefault()
    {
        var set = ReminderRuleSet.WithThresholds(DefaultReminders.All, new Dictionary<string, double> { ["arsenic-source-hot"] = 120 });

        Assert.Equal(120, set.Rules.Single(r => r.Id == "arsenic-source-hot").Threshold);
        Assert.Equal(200, set.Rules.Single(r => r.Id == "substrate-above-vent-limit").Threshold);
        Assert.Equal(DefaultReminders.All.Count, set.Rules.Count);
    }

    [Theory]
    [InlineData("no-such-rule", 1, "no reminder rule")]
    [InlineData("bakeout-running", 1, "has no threshold")]
    [InlineData("arsenic-source-hot", double.NaN, "finite number")]
    public void Check_InvalidThreshold_NamesTheProblem(string id, double value, string reason)
    {
        var problems = ReminderRuleSet.Check(DefaultReminders.All, new Dictionary<string, double> { [id] = value });

        Assert.Contains(reason, Assert.Single(problems), StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => ReminderRuleSet.WithThresholds(DefaultReminders.All, new Dictionary<string, double> { [id] = value }));
    }
}
