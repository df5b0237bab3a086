using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Options;
using RunWatch.Core.Safety;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Safety;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Safety;

public sealed class ReminderBindingsTests : IDisposable
{
    private readonly StoreHarness _harness = new();
    private readonly DashboardClock _clock = new(TimeProvider.System, Options.Create(new DashboardOptions { TimeZone = "UTC" }));

    public void Dispose() => _harness.Dispose();

    private static ChamberStatus Chamber(Dictionary<string, double> values) => new("c1", "lab", null, null, "substrate_tc", "substrate_sp", "°C",
        DateTimeOffset.UtcNow, null, null, 0, values, new TemperatureBands(3, 8),
        values.ToDictionary(kv => kv.Key, _ => DateTimeOffset.UtcNow),
        new Dictionary<ReminderChannelRole, string> { [ReminderChannelRole.GrowthTemperature] = "substrate_tc" },
        ["substrate_tc", "substrate_sp", "group5_cell"]);

    private ReminderMonitor Monitor(ReminderBindings bindings) =>
        new(new ReminderRuleSet(DefaultReminders.All), _harness.Data, _clock, bindings, Options.Create(new DashboardOptions()));

    [Fact]
    public async Task SetAsync_Admin_RoleReadsChosenChannelAuditedAndKeptAcrossRestart()
    {
        var chamber = Chamber(new() { ["substrate_tc"] = 25, ["group5_cell"] = 320 });
        var bindings = new ReminderBindings(_harness.Data, _clock, _harness.Store);
        bool watchedBefore = !Monitor(bindings).Assess(chamber).NotWatched.Any(u => u.Rule.Id == "arsenic-source-hot");

        await bindings.SetAsync(chamber, ReminderChannelRole.ArsenicSourceTemperature, "group5_cell", "ada-admin", CancellationToken.None);
        _harness.Reopen();
        var reloaded = new ReminderBindings(_harness.Data, _clock, _harness.Store);
        await reloaded.LoadAsync(CancellationToken.None);
        var assessment = Monitor(reloaded).Assess(chamber);

        Assert.False(watchedBefore);
        var arsenic = Assert.Single(assessment.Active);
        Assert.Equal("group5_cell 320.0 °C above 150 °C", arsenic.Reason);
        var audit = await _harness.Data.GetAuditAsync(10, CancellationToken.None);
        var entry = Assert.Single(audit, a => a.Action == "reminder binding edited");
        Assert.Equal("ada-admin", entry.User);
        Assert.Equal("c1 / ArsenicSourceTemperature", entry.Subject);
        Assert.Equal("ArsenicSourceTemperature: no channel → group5_cell", entry.Detail);
    }

    [Fact]
    public async Task SetAsync_NoChannel_ConfiguredRoleBecomesNotWatched_ResetRestoresIt()
    {
        var chamber = Chamber(new() { ["substrate_tc"] = 612 });
        var bindings = new ReminderBindings(_harness.Data, _clock, _harness.Store);

        await bindings.SetAsync(chamber, ReminderChannelRole.GrowthTemperature, null, "ada-admin", CancellationToken.None);
        var unmapped = Monitor(bindings).Assess(chamber);
        bool reset = await bindings.ResetAsync(chamber, ReminderChannelRole.GrowthTemperature, "ada-admin", CancellationToken.None);
        var restored = Monitor(bindings).Assess(chamber);

        Assert.Contains(unmapped.NotWatched, u => u.Rule.Id == "substrate-above-vent-limit");
        Assert.DoesNotContain(unmapped.Active, a => a.Rule.Id == "substrate-above-vent-limit");
        Assert.True(reset);
        Assert.Contains(restored.Active, a => a.Rule.Id == "substrate-above-vent-limit");
        var audit = await _harness.Data.GetAuditAsync(10, CancellationToken.None);
        Assert.Contains(audit, a => a.Action == "reminder binding reset" && a.Detail == "GrowthTemperature: no channel → as configured (substrate_tc)");
    }

    [Fact]
    public async Task SetAsync_UnknownChannel_RefusedAndNothingStored()
    {
        var chamber = Chamber(new() { ["substrate_tc"] = 25 });
        var bindings = new ReminderBindings(_harness.Data, _clock, _harness.Store);

        var error = await Assert.ThrowsAsync<ArgumentException>(() =>
            bindings.SetAsync(chamber, ReminderChannelRole.HydrideFlow, "no_such_channel", "ada-admin", CancellationToken.None));

        Assert.StartsWith("Not saved:", error.Message, StringComparison.Ordinal);
        Assert.Empty(await _harness.Store.GetReminderBindingsAsync(CancellationToken.None));
        Assert.Null(bindings.Override("c1", ReminderChannelRole.HydrideFlow));
    }

    [Fact]
    public async Task HealthCheck_InventedLab_DegradedListingEachUnwatchedReminder()
    {
        var time = new Microsoft.Extensions.Time.Testing.FakeTimeProvider(DashboardTestContext.Now);
        var data = new InMemoryDashboardData(time);
        InventedLabScenario.Seed(data, DashboardTestContext.Now);
        var clock = new DashboardClock(time, Options.Create(new DashboardOptions { TimeZone = "UTC" }));
        var monitor = new ReminderMonitor(new ReminderRuleSet(DefaultReminders.All), data, clock, new ReminderBindings(data, clock),
            Options.Create(new DashboardOptions()));
        var check = new ReminderCoverageHealthCheck(data, monitor);

        var result = await check.CheckHealthAsync(new HealthCheckContext(), CancellationToken.None);

        Assert.Equal(HealthStatus.Degraded, result.Status);
        // Hydride flow, bake-out and the electron gun have no channel on either invented chamber.
        foreach (string chamber in new[] { InventedLabScenario.GrowingChamber, InventedLabScenario.IdleChamber })
        {
            foreach (string rule in new[] { "hydride-flowing", "bakeout-running", "electron-gun-on" })
            {
                Assert.StartsWith("not watched on this chamber:", (string)result.Data[chamber + "/" + rule], StringComparison.Ordinal);
            }
        }
        Assert.False(result.Data.ContainsKey(InventedLabScenario.GrowingChamber + "/arsenic-source-hot"));
    }
}
