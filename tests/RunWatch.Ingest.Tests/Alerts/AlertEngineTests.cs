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
