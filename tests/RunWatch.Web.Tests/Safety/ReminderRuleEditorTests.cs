using Microsoft.Extensions.Options;
using RunWatch.Core.Safety;
using RunWatch.Web;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Safety;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Safety;

/// <summary>Reminder thresholds edited by an admin, stored in a real SQLite file and back in force after a restart.</summary>
public sealed class ReminderRuleEditorTests : IDisposable
{
    private const string VentRule = "substrate-above-vent-limit";
    private readonly StoreHarness _harness = new();
    private readonly DashboardClock _clock = new(TimeProvider.System, Options.Create(new DashboardOptions { TimeZone = "UTC" }));

    public void Dispose() => _harness.Dispose();

    private ReminderRuleEditor Editor(ReminderRuleSet rules) => new(rules, _harness.Data, _clock, _harness.Store);

    /// <summary>Substrate at 180 °C, no run: is the venting reminder shown?</summary>
    private static bool VentReminderHolds(ReminderRuleSet rules) =>
        ReminderEvaluator.Evaluate(rules.Rules, new LiveChamberState("c1", DateTimeOffset.UtcNow, DateTimeOffset.UtcNow,
            new Dictionary<string, double> { ["substrate_tc"] = 180 }, false, null,
            new Dictionary<ReminderChannelRole, string> { [ReminderChannelRole.GrowthTemperature] = "substrate_tc" })).Any(a => a.Rule.Id == VentRule);

    [Fact]
    public async Task UpdateThresholdAsync_Admin_ReminderUsesNewThresholdAlsoAfterRestart()
    {
        var rules = new ReminderRuleSet(DefaultReminders.All);
        var editor = Editor(rules);
        await editor.LoadAsync(CancellationToken.None);
        bool holdsAtDefault = VentReminderHolds(rules); // 180 °C is below the default 200 °C

        await editor.UpdateThresholdAsync(VentRule, 150, "ada-admin", CancellationToken.None);
        bool holdsAfterEdit = VentReminderHolds(rules);

        _harness.Reopen();
        var rulesAfterRestart = new ReminderRuleSet(DefaultReminders.All);
        await Editor(rulesAfterRestart).LoadAsync(CancellationToken.None);

        Assert.False(holdsAtDefault);
        Assert.True(holdsAfterEdit);
        Assert.Equal(150, rulesAfterRestart.Rules.Single(r => r.Id == VentRule).Threshold);
        Assert.True(VentReminderHolds(rulesAfterRestart));
        var audit = await _harness.Data.GetAuditAsync(10, CancellationToken.None);
        var entry = Assert.Single(audit, a => a.Action == "reminder edited");
        Assert.Equal("ada-admin", entry.User);
        Assert.Equal("threshold 200 → 150 °C", entry.Detail);
    }

    [Theory]
    [InlineData(VentRule, double.NaN, "finite number")]
    [InlineData(VentRule, -300, "below absolute zero")]
    [InlineData("hydride-flowing", -1, "cannot be negative")]
    [InlineData("cryopanel-filling", 1, "has no threshold")]
    public async Task UpdateThresholdAsync_InvalidValue_RefusedAndNothingChanged(string ruleId, double threshold, string reason)
    {
        var rules = new ReminderRuleSet(DefaultReminders.All);
        var editor = Editor(rules);
        await editor.LoadAsync(CancellationToken.None);
        var before = rules.Rules;

        var ex = await Assert.ThrowsAsync<ArgumentException>(() => editor.UpdateThresholdAsync(ruleId, threshold, "ada-admin", CancellationToken.None));

        Assert.Contains(reason, ex.Message, StringComparison.Ordinal);
        Assert.Same(before, rules.Rules);
        Assert.All(await _harness.Store.GetReminderSettingsAsync(CancellationToken.None), s => Assert.Equal("configuration", s.UpdatedBy));
        Assert.Empty(await _harness.Data.GetAuditAsync(10, CancellationToken.None));
    }

    [Fact]
    public async Task UpdateThresholdAsync_WithoutStore_AuditedThroughCommands()
    {
        var data = new InMemoryDashboardData(TimeProvider.System);
        var rules = new ReminderRuleSet(DefaultReminders.All);
        var editor = new ReminderRuleEditor(rules, data, _clock);

        await editor.UpdateThresholdAsync(VentRule, 120, "ada-admin", CancellationToken.None);

        Assert.False(editor.IsPersisted);
        Assert.Equal(120, rules.Rules.Single(r => r.Id == VentRule).Threshold);
        Assert.Contains(await data.GetAuditAsync(10, CancellationToken.None), a => a.Action == "reminder edited" && a.User == "ada-admin");
    }
}
