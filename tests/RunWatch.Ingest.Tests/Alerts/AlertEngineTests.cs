using Microsoft.Extensions.Time.Testing;
using RunWatch.Core.Excursions;
using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Tests.Support;

namespace RunWatch.Ingest.Tests.Alerts;

public sealed class AlertEngineTests
{
    private static readonly DateTimeOffset T0 = Batches.T0;
    private readonly FakeTimeProvider _time = new(T0);

    [Fact]
    public void OnCommitted_TemperatureLeavesAndReturnsToTheBand_RaisesThenReturnsUnacknowledged()
    {
        var engine = Engine();
        var samples = new List<(double, long, double)> { (0, 11, 600) };
        for (int s = 0; s < 60; s++)
        {
            // 20 K above the setpoint from 10 s to 30 s: beyond the warning (5 K) and alarm (15 K) bands for longer than 5 s.
            samples.Add((s, 10, s is >= 10 and < 30 ? 620 : 600));
        }

        engine.OnCommitted(Batches.Of([.. samples]), [], T0);

        var signals = Drain(engine);
        var alarm = signals.Where(x => x.Kind == "deviation-alarm").ToList();
        Assert.Equal([AlarmState.ActiveUnacknowledged, AlarmState.ReturnedToNormalUnacknowledged], alarm.Select(x => x.To));
        Assert.All(alarm, x => Assert.Equal("C1/deviation-alarm", x.Key));
        Assert.Contains(signals, x => x.Kind == "deviation-warning" && x.To == AlarmState.ActiveUnacknowledged);
        Assert.True(alarm[0].At >= T0.AddSeconds(10) && alarm[0].At <= T0.AddSeconds(16));

        Assert.True(engine.Acknowledge("C1", "deviation-alarm"));
        Assert.Equal(AlarmState.Normal, Drain(engine).Single(x => x.Kind == "deviation-alarm").To);
    }

    [Fact]
    public void OnCommitted_HeatingRampThenHoldExcursion_RampRecordedSuppressedHoldExcursionRaised()
    {
        var engine = Engine();
        // Setpoint 610 °C from the start; the substrate follows as a first-order heater (τ = 60 s) from 200 °C,
        // the usual model of a heater approaching a stepped setpoint (COMMON PRACTICE, no source).
        var samples = new List<(double, long, double)> { (0, 11, 610) };
        for (int s = 0; s < 600; s++)
        {
            samples.Add((s, 10, 610 - (410 * Math.Exp(-s / 60.0))));
        }
        for (int s = 600; s < 660; s++)
        {
            samples.Add((s, 10, s is >= 610 and < 640 ? 590 : 610)); // 20 K low for 30 s in hold
        }

        engine.OnCommitted(Batches.Of([.. samples]), [], T0);

        var alarm = Drain(engine).Where(x => x.Kind == "deviation-alarm").ToList();
        Assert.Equal(AlarmState.SuppressedByDesign, alarm[0].To);
        Assert.Equal(AlarmState.Normal, alarm[1].To);
        // DERIVED: the alarm condition clears below band − hysteresis = 15 − 1 K (defaults): 410·exp(−t/60) < 14 ⇒ t > 60·ln(410/14) = 202.6 s.
        Assert.Equal(Math.Ceiling(60 * Math.Log(410 / 14.0)), (alarm[1].At - T0).TotalSeconds);
        var raised = Assert.Single(alarm, x => x.To == AlarmState.ActiveUnacknowledged);
        Assert.InRange((raised.At - T0).TotalSeconds, 610, 616);
    }

    [Fact]
    public void Tick_NoTelemetryDuringAnOpenRun_RaisesStaleTelemetry()
    {
        var engine = Engine();
        engine.RunStarted(1, Storage.UnixMicros.From(T0), 600);
        engine.OnCommitted(Batches.Of((0, 10, 600), (1, 10, 600)), [], T0);
        Drain(engine);

        engine.Tick(T0.AddSeconds(20));
        Assert.DoesNotContain(Drain(engine), x => x.Kind == "stale-telemetry");
        engine.Tick(T0.AddSeconds(40));

        var stale = Drain(engine).Single(x => x.Kind == "stale-telemetry");
        Assert.Equal(AlarmState.ActiveUnacknowledged, stale.To);
    }

    [Fact]
    public void StoreUnavailable_Twice_RaisesOnceAndClearsOnRecovery()
    {
        var engine = Engine();
        engine.StoreUnavailable("disk full");
        engine.StoreUnavailable("disk full");
        engine.StoreRecovered();

        var signals = Drain(engine);
        Assert.Equal([AlarmState.ActiveUnacknowledged, AlarmState.ReturnedToNormalUnacknowledged], signals.Select(x => x.To));
        Assert.All(signals, x => Assert.Equal("store-unwritable", x.Kind));
    }

    private AlertEngine Engine()
    {
        var holder = new ChamberRegistryHolder();
        holder.Set(TestChambers.Registry());
        return new AlertEngine(holder, _time);
    }

    private static List<AlertSignal> Drain(AlertEngine engine)
    {
        var list = new List<AlertSignal>();
        while (engine.Signals.TryRead(out var s))
        {
            list.Add(s);
        }
        return list;
    }
}
