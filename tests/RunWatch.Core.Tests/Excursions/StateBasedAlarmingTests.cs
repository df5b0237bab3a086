using RunWatch.Core.Excursions;
using Xunit;

namespace RunWatch.Core.Tests.Excursions;

/// <summary>
/// State-based alarming (ISA-18.2 designed suppression) against a simulated heater: a first-order lag
/// T(t) = T_sp + (T_0 − T_sp)·exp(−t/τ) with seeded noise, the usual model of a substrate heater approaching a
/// stepped setpoint (COMMON PRACTICE, no source). Arrival times come from the closed form, not from the monitor.
/// </summary>
public sealed class StateBasedAlarmingTests
{
    private const double Tau = 60;      // s, heater time constant of the simulated chamber
    private const double Start = 200;   // °C before the step
    private const double Target = 610;  // °C growth setpoint

    private static ExcursionOptions Options() => new()
    {
        WarningBandK = 5,
        AlarmBandK = 15,
        HysteresisK = 1,
        MinimumDuration = TimeSpan.FromSeconds(2),
        StaleAfter = null,
        FlatlineWindow = null,
    };

    /// <summary>Heater response to a setpoint step at t = 0, sampled at 1 Hz with ±0.2 K noise (seeded).</summary>
    private static double Heater(double t, Random noise) =>
        Target + ((Start - Target) * Math.Exp(-t / Tau)) + ((noise.NextDouble() - 0.5) * 0.4);

    [Fact]
    public void HeatingRamp_NoDeviationAlarmRaised_SuppressedConditionRecorded_HoldFromClosedFormArrival()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        var noise = new Random(14);
        monitor.BeginRun(-10);
        for (int t = -10; t < 0; t++)
        {
            monitor.Observe(t, Start, Start); // holding at the idle setpoint
        }
        var holdAt = double.NaN;
        for (int t = 0; t <= 600; t++)
        {
            monitor.Observe(t, Heater(t, noise), Target);
            if (double.IsNaN(holdAt) && monitor.State == RecipeState.Hold)
            {
                holdAt = t;
            }
        }

        // DERIVED: |T − T_sp| = 410·exp(−t/τ) ≤ warning band − hysteresis = 4 K ⇒ t ≥ τ·ln(410/4) = 277.5 s; noise ±0.2 K moves it by < 4 s.
        double arrival = Tau * Math.Log((Target - Start) / 4.0);
        Assert.InRange(holdAt, arrival - 4, arrival + 4);
        Assert.DoesNotContain(observer.Transitions, x => x.To == AlarmState.ActiveUnacknowledged);
        Assert.Contains(observer.Of(AlarmKind.DeviationAlarm), x => x.To == AlarmState.SuppressedByDesign && x.TimeS < 10);
        Assert.Equal(AlarmState.Normal, monitor.GetState(AlarmKind.DeviationAlarm));
        var ramp = Assert.Single(observer.Excursions);
        Assert.True(ramp.SuppressedByDesign);
    }

    [Fact]
    public void HoldExcursionAfterRamp_RaisesAlarmAndIsNotSuppressed()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        var noise = new Random(15);
        for (int t = 0; t <= 500; t++)
        {
            monitor.Observe(t, Heater(t, noise), Target);
        }
        for (int t = 501; t <= 540; t++)
        {
            monitor.Observe(t, Target - 20, Target); // heater fault in hold: 20 K low for 40 s
        }
        for (int t = 541; t <= 560; t++)
        {
            monitor.Observe(t, Target, Target);
        }

        var raised = Assert.Single(observer.Of(AlarmKind.DeviationAlarm), x => x.To == AlarmState.ActiveUnacknowledged);
        Assert.InRange(raised.TimeS, 501, 505);
        Assert.Equal(2, observer.Excursions.Count);
        Assert.True(observer.Excursions[0].SuppressedByDesign);
        Assert.False(observer.Excursions[1].SuppressedByDesign);
        Assert.Equal(-20, observer.Excursions[1].PeakDeviationK, 6);
    }

    [Fact]
    public void CoolingRamp_AfterSetpointDrop_NoAlarm()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        for (int t = 0; t <= 20; t++)
        {
            monitor.Observe(t, Target, Target);
        }
        // Setpoint drops to 200 °C; the substrate cools with the same lag.
        for (int t = 21; t <= 400; t++)
        {
            monitor.Observe(t, Start + ((Target - Start) * Math.Exp(-(t - 21) / Tau)), Start);
        }

        Assert.DoesNotContain(observer.Transitions, x => x.To == AlarmState.ActiveUnacknowledged);
        Assert.Equal(RecipeState.Hold, monitor.State);
    }

    [Fact]
    public void HeaterThatNeverArrives_AlarmRaisedAtRampTimeout()
    {
        var options = Options();
        options.RampTimeout = TimeSpan.FromSeconds(120);
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(options, observer: observer);
        for (int t = 0; t <= 300; t++)
        {
            monitor.Observe(t, Math.Min(400, Start + t), Target); // heater saturates at 400 °C
        }

        var raised = Assert.Single(observer.Of(AlarmKind.DeviationAlarm), x => x.To == AlarmState.ActiveUnacknowledged);
        // The ramp began at the first sample (t = 0); the timeout is exceeded at the first sample after 120 s.
        Assert.Equal(121, raised.TimeS);
        Assert.Equal(AlarmState.SuppressedByDesign, observer.Of(AlarmKind.DeviationAlarm).First().To);
    }

    [Fact]
    public void GrowthShutterOpenOffSetpoint_AlarmRaisedAtOnce()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        for (int t = 0; t <= 30; t++)
        {
            monitor.Observe(t, 560, Target); // still 50 K low: ramp, suppressed
        }
        monitor.SetGrowth(true, 30.5);

        Assert.Equal(RecipeState.Growth, monitor.State);
        var raised = Assert.Single(observer.Of(AlarmKind.DeviationAlarm), x => x.To == AlarmState.ActiveUnacknowledged);
        Assert.Equal(30.5, raised.TimeS);
    }

    [Fact]
    public void RuleAlways_HeatingRamp_RaisesAlarmAsBefore()
    {
        var options = Options();
        options.DeviationAlarming = DeviationAlarmRule.Always;
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(options, observer: observer);
        var noise = new Random(16);
        for (int t = 0; t <= 400; t++)
        {
            monitor.Observe(t, Heater(t, noise), Target);
        }

        Assert.Contains(observer.Of(AlarmKind.DeviationAlarm), x => x.To == AlarmState.ActiveUnacknowledged);
        Assert.DoesNotContain(observer.Transitions, x => x.To == AlarmState.SuppressedByDesign);
    }

    [Fact]
    public void ShelvedAndSuppressed_AreDistinctStates()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        for (int t = 0; t <= 10; t++)
        {
            monitor.Observe(t, Target, Target);
        }
        monitor.Shelve(AlarmKind.DeviationAlarm, 1000, 10.5);
        for (int t = 11; t <= 20; t++)
        {
            monitor.Observe(t, Target - 30, Target); // hold excursion while shelved
        }
        Assert.Equal(AlarmState.Shelved, monitor.GetState(AlarmKind.DeviationAlarm));
        Assert.Equal(RecipeState.Hold, monitor.State);
        for (int t = 21; t <= 30; t++)
        {
            monitor.Observe(t, Target - 30, 700); // setpoint raised: a ramp; the warning alarm (not shelved) is suppressed
        }

        Assert.Equal(AlarmState.Shelved, monitor.GetState(AlarmKind.DeviationAlarm));
        Assert.Equal(AlarmState.ActiveUnacknowledged, monitor.GetState(AlarmKind.DeviationWarning)); // raised in hold, before the ramp
        Assert.False(monitor.Acknowledge(AlarmKind.DeviationAlarm, 31));
    }
}
