using Xunit;
using RunWatch.Core.Safety;

namespace RunWatch.Core.Tests.Safety;

public sealed class ReminderEvaluatorTests
{
    private static readonly DateTimeOffset Now = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    private static LiveChamberState State(Dictionary<string, double> values, DateTimeOffset? lastSample = null, bool runActive = false, DateTimeOffset? runEnded = null) =>
        new("C1", Now, lastSample ?? Now.AddSeconds(-1), values, runActive, runEnded);

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
}
