using Xunit;
using RunWatch.Core.Safety;

namespace RunWatch.Core.Tests.Safety;

public sealed class ReminderEvaluatorTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    // A chamber that maps every role, to its own channel names.
    private static readonly Dictionary<ReminderChannelRole, string> AllRoles = new()
    {
        [ReminderChannelRole.GrowthTemperature] = "substrate_tc",
        [ReminderChannelRole.ArsenicSourceTemperature] = "as_cell_tc",
        [ReminderChannelRole.HydrideFlow] = "hydride_flow_sccm",
        [ReminderChannelRole.CryopanelFill] = "ln2_fill",
        [ReminderChannelRole.Bakeout] = "bakeout",
        [ReminderChannelRole.ElectronGunHighVoltage] = "egun_hv",
    };

    private static LiveChamberState State(Dictionary<string, double> values, DateTimeOffset? lastSample = null, bool runActive = false, DateTimeOffset? runEnded = null) =>
        new("C1", Now, lastSample ?? Now.AddSeconds(-1), values, runActive, runEnded, AllRoles);

    private static IReadOnlyList<string> Ids(LiveChamberState state) =>
        ReminderEvaluator.Evaluate(DefaultReminders.All, state).Select(r => r.Rule.Id).ToList();

    [Fact]
    public void Evaluate_ColdIdleChamber_NoReminders()
    {
        Assert.Empty(Ids(State(new() { ["substrate_tc"] = 25, ["as_cell_tc"] = 25, ["ln2_fill"] = 0 })));
    }

    [Fact]
    public void Evaluate_HotSubstrate_ShowsVentLimitWithReadingAndUnit()
    {
        var active = ReminderEvaluator.Evaluate(DefaultReminders.All, State(new() { ["substrate_tc"] = 612.3 }));

        var vent = Assert.Single(active, r => r.Rule.Id == "substrate-above-vent-limit");
        Assert.Equal("substrate_tc 612.3 °C above 200 °C", vent.Reason);
    }

    [Fact]
    public void Evaluate_AtThreshold_DoesNotHold()
    {
        Assert.DoesNotContain("substrate-above-vent-limit", Ids(State(new() { ["substrate_tc"] = 200 })));
    }

    [Fact]
    public void Evaluate_ArsenicHotAndCryopanelFilling_ShowsBoth()
    {
        var ids = Ids(State(new() { ["as_cell_tc"] = 320, ["ln2_fill"] = 1 }));
        Assert.Contains("arsenic-source-hot", ids);
        Assert.Contains("cryopanel-filling", ids);
    }

    [Fact]
    public void Evaluate_RunEndedRecentlyStillHot_Holds_ButNotWhileRunActiveOrLongAfter()
    {
        var values = new Dictionary<string, double> { ["substrate_tc"] = 150 };
        Assert.Contains("run-ended-still-hot", Ids(State(values, runEnded: Now.AddMinutes(-10))));
        Assert.DoesNotContain("run-ended-still-hot", Ids(State(values, runActive: true, runEnded: Now.AddMinutes(-10))));
        Assert.DoesNotContain("run-ended-still-hot", Ids(State(values, runEnded: Now.AddHours(-3))));
    }

    [Fact]
    public void Evaluate_NoSampleFor31Seconds_TelemetryStale()
    {
        var active = ReminderEvaluator.Evaluate(DefaultReminders.All, State([], lastSample: Now.AddSeconds(-31)));

        var stale = Assert.Single(active);
        Assert.Equal("telemetry-stale", stale.Rule.Id);
        Assert.Equal("last sample 31 s ago (limit 30 s)", stale.Reason);
    }

    [Fact]
    public void Evaluate_MissingOrNaNChannel_DoesNotHold()
    {
        Assert.Empty(Ids(State(new() { ["substrate_tc"] = double.NaN })));
    }

    [Fact]
    public void Assess_MissingOrNaNChannel_ReportedNotWatched()
    {
        var assessment = ReminderEvaluator.Assess(DefaultReminders.All, State(new() { ["substrate_tc"] = double.NaN }));

        var vent = Assert.Single(assessment.NotWatched, u => u.Rule.Id == "substrate-above-vent-limit");
        Assert.Equal("channel substrate_tc (GrowthTemperature) has no recent value", vent.Reason);
    }

    [Fact]
    public void Assess_RoleMappedToChamberOwnChannel_ReadsThatChannel()
    {
        // A chamber that names its arsenic cell thermocouple differently maps the role to its own channel.
        var roles = new Dictionary<ReminderChannelRole, string> { [ReminderChannelRole.ArsenicSourceTemperature] = "group5_cell" };
        var state = new LiveChamberState("C2", Now, Now, new Dictionary<string, double> { ["group5_cell"] = 320, ["as_cell_tc"] = 20 }, false, null, roles);

        var assessment = ReminderEvaluator.Assess(DefaultReminders.All, state);

        var arsenic = Assert.Single(assessment.Active);
        Assert.Equal("arsenic-source-hot", arsenic.Rule.Id);
        Assert.Equal("group5_cell 320.0 °C above 150 °C", arsenic.Reason);
    }

    [Fact]
    public void Assess_ChamberMappingOnlyGrowthTemperature_EveryOtherChannelRuleNotWatched()
    {
        // The example chamber: substrate thermocouple mapped, the arsenic channel is a beam-pressure gauge with no role.
        var roles = new Dictionary<ReminderChannelRole, string> { [ReminderChannelRole.GrowthTemperature] = "substrate_tc" };
        var values = new Dictionary<string, double> { ["substrate_tc"] = 610, ["as_bep"] = 2e-6 };
        var state = new LiveChamberState("demo-1", Now, Now, values, true, null, roles);

        var assessment = ReminderEvaluator.Assess(DefaultReminders.All, state);

        Assert.Equal(["substrate-above-vent-limit"], assessment.Active.Select(a => a.Rule.Id));
        Assert.Equal(["arsenic-source-hot", "hydride-flowing", "cryopanel-filling", "bakeout-running", "electron-gun-on"],
            assessment.NotWatched.Select(u => u.Rule.Id));
        Assert.Equal("no channel has the role ArsenicSourceTemperature on this chamber", assessment.NotWatched[0].Reason);
        // Every rule is either judged (held or clear) or reported: none is silently dropped.
        int judged = DefaultReminders.All.Count - assessment.NotWatched.Count;
        Assert.Equal(3, judged);
    }

    [Fact]
    public void Assess_MappedChannelOlderThanLimit_NotWatchedEvenIfValueWouldHold()
    {
        var values = new Dictionary<string, double> { ["substrate_tc"] = 612, ["ln2_fill"] = 1 };
        var times = new Dictionary<string, DateTimeOffset> { ["substrate_tc"] = Now.AddSeconds(-2), ["ln2_fill"] = Now.AddSeconds(-95) };
        var state = new LiveChamberState("C1", Now, Now.AddSeconds(-2), values, true, null, AllRoles, times, TimeSpan.FromSeconds(60));

        var assessment = ReminderEvaluator.Assess(DefaultReminders.All, state);

        Assert.Contains(assessment.Active, a => a.Rule.Id == "substrate-above-vent-limit");
        Assert.DoesNotContain(assessment.Active, a => a.Rule.Id == "cryopanel-filling");
        var fill = Assert.Single(assessment.NotWatched, u => u.Rule.Id == "cryopanel-filling");
        Assert.Equal("channel ln2_fill (CryopanelFill) last sampled 95 s ago (limit 60 s)", fill.Reason);
    }

    [Fact]
    public void Assess_NoRoleMap_OnlyStalenessRuleJudged()
    {
        var state = new LiveChamberState("C3", Now, Now.AddSeconds(-1), new Dictionary<string, double> { ["substrate_tc"] = 900 }, false, null);

        var assessment = ReminderEvaluator.Assess(DefaultReminders.All, state);

        Assert.Empty(assessment.Active);
        Assert.Equal(DefaultReminders.All.Count - 1, assessment.NotWatched.Count);
        Assert.DoesNotContain(assessment.NotWatched, u => u.Rule.Kind == ReminderConditionKind.TelemetryStale);
    }
}
