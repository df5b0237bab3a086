using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using RunWatch.Core.Safety;
using RunWatch.Web.Hosting;
using RunWatch.Web.Safety;
using Xunit;

namespace RunWatch.Web.Tests.Hosting;

/// <summary>The dashboard's options report each bad reminder threshold at start, in the rule set's own words.</summary>
public sealed class DashboardOptionsValidationTests
{
    [Fact]
    public void Options_TwoBadReminderThresholds_EachReported()
    {
        var builder = WebApplication.CreateBuilder();
        builder.Configuration.AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["RunWatch:Dashboard:ReminderThresholds:no-such-rule"] = "1",
            ["RunWatch:Dashboard:ReminderThresholds:another-unknown-rule"] = "2",
        });
        builder.AddRunWatchDashboard();
        using var provider = builder.Services.BuildServiceProvider();

        var ex = Assert.Throws<OptionsValidationException>(() => provider.GetRequiredService<IOptions<DashboardOptions>>().Value);

        var thresholds = new Dictionary<string, double> { ["no-such-rule"] = 1, ["another-unknown-rule"] = 2 };
        var expected = ReminderRuleSet.Check(DefaultReminders.All, thresholds).Select(e => DashboardOptions.SectionName + ": " + e).Order(StringComparer.Ordinal);
        Assert.Equal(expected, ex.Failures.Order(StringComparer.Ordinal));
        Assert.Equal(2, ex.Failures.Count());
    }
}
