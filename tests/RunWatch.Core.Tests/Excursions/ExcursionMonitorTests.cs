using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Excursions;

public sealed class ExcursionMonitorTests
{
    private const double Setpoint = 600;

    private static ExcursionOptions Options() => new()
    {
        WarningBandK = 5,
        AlarmBandK = 15,
        HysteresisK = 1,
        MinimumDuration = TimeSpan.FromSeconds(5),
        StaleAfter = TimeSpan.FromSeconds(30),
        FlatlineWindow = null,
    };

    private static void Feed(ExcursionMonitor monitor, double fromS, double toS, double valueC, double setpointC = Setpoint)
    {
        for (double t = fromS; t <= toS + 1e-9; t += 1)
        {
            monitor.Observe(t, valueC, setpointC);
        }
    }

    [Fact]
    public void Observe_WarningAcknowledgedThenCleared_GoesNormalWithSummary()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        Feed(monitor, 0, 9, 600);
        Feed(monitor, 10, 30, 608);
        Assert.Equal(AlarmState.ActiveUnacknowledged, monitor.GetState(AlarmKind.DeviationWarning));
        Assert.Equal(15.0, observer.Of(AlarmKind.DeviationWarning).First().TimeS);
        Assert.True(monitor.Acknowledge(AlarmKind.DeviationWarning, 31));
        Assert.Equal(AlarmState.ActiveAcknowledged, monitor.GetState(AlarmKind.DeviationWarning));
        Assert.False(monitor.Acknowledge(AlarmKind.DeviationWarning, 31));
        Feed(monitor, 31, 40, 600);
        Assert.Equal(AlarmState.Normal, monitor.GetState(AlarmKind.DeviationWarning));

        ExcursionSummary summary = Assert.Single(observer.Excursions);
        Assert.Equal(10, summary.StartS);
        Assert.Equal(31, summary.EndS);
        Assert.Equal(21, summary.DurationS);
        Assert.Equal(8, summary.PeakDeviationK, 1e-12);
        Assert.Equal(ExcursionSeverity.Warning, summary.Severity);
        Assert.True(summary.Closed);
        Assert.True(double.IsNaN(summary.ExcessIntegralCmSq));
        Assert.Equal(
            [AlarmState.ActiveUnacknowledged, AlarmState.ActiveAcknowledged, AlarmState.Normal],
            observer.Of(AlarmKind.DeviationWarning).Select(t => t.To));
    }

    [Fact]
    public void Observe_ClearsBeforeAcknowledge_WaitsInReturnedToNormalUnacknowledged()
    {
        // Off setpoint from the first sample is a ramp under the state-based rule; this test is about the ISA-18.2 lifecycle.
        var options = Options();
        options.DeviationAlarming = DeviationAlarmRule.Always;
        var monitor = new ExcursionMonitor(options);
        Feed(monitor, 0, 20, 593);
        Feed(monitor, 21, 25, 600);
        Assert.Equal(AlarmState.ReturnedToNormalUnacknowledged, monitor.GetState(AlarmKind.DeviationWarning));
        Feed(monitor, 26, 40, 593);
        Assert.Equal(AlarmState.ActiveUnacknowledged, monitor.GetState(AlarmKind.DeviationWarning));
        Feed(monitor, 41, 45, 600);
        Assert.True(monitor.Acknowledge(AlarmKind.DeviationWarning, 46));
        Assert.Equal(AlarmState.Normal, monitor.GetState(AlarmKind.DeviationWarning));
    }

    [Fact]
    public void Observe_DeviationShorterThanMinimumDuration_IsIgnored()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        Feed(monitor, 0, 9, 600);
        Feed(monitor, 10, 13, 630);
        Feed(monitor, 14, 30, 600);
        Assert.Empty(observer.Transitions);
        Assert.Empty(observer.Excursions);
    }

    [Fact]
    public void Observe_InsideHysteresisBand_StaysActiveUntilBandLessHysteresis()
    {
        var monitor = new ExcursionMonitor(Options());
        Feed(monitor, 0, 10, 607);
        Assert.True(monitor.IsConditionActive(AlarmKind.DeviationWarning));
        Feed(monitor, 11, 20, 604.5); // inside the 5 K band but not 1 K inside it
        Assert.True(monitor.IsConditionActive(AlarmKind.DeviationWarning));
        Assert.True(monitor.ExcursionOpen);
        Feed(monitor, 21, 21, 603.9);
        Assert.False(monitor.IsConditionActive(AlarmKind.DeviationWarning));
        Assert.False(monitor.ExcursionOpen);
    }

    [Fact]
    public void Observe_BeyondAlarmBand_RaisesAlarmAndSeverity()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        Feed(monitor, 0, 4, 600);
        Feed(monitor, 5, 12, 610);
        Feed(monitor, 13, 25, 620);
        Feed(monitor, 26, 30, 600);
        Assert.Equal(AlarmState.ReturnedToNormalUnacknowledged, monitor.GetState(AlarmKind.DeviationAlarm));
        Assert.Equal(18.0, observer.Of(AlarmKind.DeviationAlarm).First().TimeS);
        ExcursionSummary summary = Assert.Single(observer.Excursions);
        Assert.Equal(ExcursionSeverity.Alarm, summary.Severity);
        Assert.Equal(20, summary.PeakDeviationK, 1e-12);
        Assert.Equal(13, summary.PeakTimeS);
        Assert.Equal(5, summary.StartS);
    }

    [Fact]
    public void Observe_AbsoluteLimits_RaiseImmediatelyAndClearWithHysteresis()
    {
        var options = Options();
        options.HighLimitC = 650;
        options.LowLimitC = 200;
        var monitor = new ExcursionMonitor(options);
        monitor.Observe(0, 651, double.NaN);
        Assert.Equal(AlarmState.ActiveUnacknowledged, monitor.GetState(AlarmKind.HighLimit));
        monitor.Observe(1, 649.5, double.NaN);
        Assert.True(monitor.IsConditionActive(AlarmKind.HighLimit));
        monitor.Observe(2, 648.9, double.NaN);
        Assert.False(monitor.IsConditionActive(AlarmKind.HighLimit));
        monitor.Observe(3, 199, double.NaN);
        Assert.True(monitor.IsConditionActive(AlarmKind.LowLimit));
        monitor.Observe(4, 200.5, double.NaN);
        Assert.True(monitor.IsConditionActive(AlarmKind.LowLimit));
        monitor.Observe(5, 201.1, double.NaN);
        Assert.False(monitor.IsConditionActive(AlarmKind.LowLimit));
    }

    [Fact]
    public void Observe_FastRamp_RaisesRateOfChange()
    {
        var options = Options();
        options.MaxRateKPerS = 2;
        var monitor = new ExcursionMonitor(options);
        for (int i = 0; i <= 20; i++)
        {
            monitor.Observe(i * 0.1, 500 + i * 0.1 * 1.5, double.NaN); // 1.5 K/s
        }
        Assert.False(monitor.IsConditionActive(AlarmKind.RateOfChange));
        for (int i = 21; i <= 40; i++)
        {
            monitor.Observe(i * 0.1, 503 + (i - 20) * 0.1 * 5, double.NaN); // 5 K/s
        }
        Assert.True(monitor.IsConditionActive(AlarmKind.RateOfChange));
        for (int i = 41; i <= 70; i++)
        {
            monitor.Observe(i * 0.1, 513, double.NaN);
        }
        Assert.False(monitor.IsConditionActive(AlarmKind.RateOfChange));
        Assert.Equal(AlarmState.ReturnedToNormalUnacknowledged, monitor.GetState(AlarmKind.RateOfChange));
    }

    [Fact]
    public void Tick_NoSampleDuringRun_RaisesStaleUntilNextSample()
    {
        var monitor = new ExcursionMonitor(Options());
        monitor.Tick(1000);
        Assert.False(monitor.IsConditionActive(AlarmKind.Stale)); // no run, no stale alarm
        monitor.BeginRun(1000);
        Feed(monitor, 1000, 1010, 600);
        monitor.Tick(1035);
        Assert.False(monitor.IsConditionActive(AlarmKind.Stale));
        monitor.Tick(1041);
        Assert.Equal(AlarmState.ActiveUnacknowledged, monitor.GetState(AlarmKind.Stale));
        monitor.Observe(1042, 600, Setpoint);
        Assert.Equal(AlarmState.ReturnedToNormalUnacknowledged, monitor.GetState(AlarmKind.Stale));
    }

    [Fact]
    public void Tick_RunStartedWithoutAnySample_RaisesStale()
    {
        var monitor = new ExcursionMonitor(Options());
        monitor.BeginRun(0);
        monitor.Tick(31);
        Assert.True(monitor.IsConditionActive(AlarmKind.Stale));
        monitor.EndRun(32);
        Assert.False(monitor.IsConditionActive(AlarmKind.Stale));
    }

    [Fact]
    public void Observe_StuckReadingDuringRun_RaisesFlatline()
    {
        var options = Options();
        options.FlatlineWindow = TimeSpan.FromSeconds(60);
        options.FlatlineEpsilonK = 0.01;
        var monitor = new ExcursionMonitor(options);
        monitor.BeginRun(0);
        var random = new Random(3);
        for (int t = 0; t <= 120; t++)
        {
            monitor.Observe(t, 600 + 0.2 * (random.NextDouble() - 0.5), Setpoint);
        }
        Assert.False(monitor.IsConditionActive(AlarmKind.Flatline));
        for (int t = 121; t <= 180; t++)
        {
            monitor.Observe(t, 600.004, Setpoint);
        }
        Assert.False(monitor.IsConditionActive(AlarmKind.Flatline)); // 59 s so far
        monitor.Observe(181, 600.004, Setpoint);
        Assert.True(monitor.IsConditionActive(AlarmKind.Flatline));
        monitor.Observe(182, 600.3, Setpoint);
        Assert.False(monitor.IsConditionActive(AlarmKind.Flatline));
    }

    [Fact]
    public void Shelve_ActiveAlarm_SuppressesUntilExpiryThenReturnsToActiveUnacknowledged()
    {
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), observer: observer);
        Feed(monitor, 0, 10, 608);
        monitor.Shelve(AlarmKind.DeviationWarning, untilS: 100, nowS: 11);
        Assert.Equal(AlarmState.Shelved, monitor.GetState(AlarmKind.DeviationWarning));
        Assert.Equal(100, monitor.ShelvedUntilS(AlarmKind.DeviationWarning));
        int before = observer.Transitions.Count;
        Feed(monitor, 12, 20, 600);
        Feed(monitor, 21, 40, 608);
        Assert.Equal(before, observer.Transitions.Count); // condition changes while shelved are not announced
        Assert.False(monitor.Acknowledge(AlarmKind.DeviationWarning, 41));
        monitor.Tick(100);
        Assert.Equal(AlarmState.ActiveUnacknowledged, monitor.GetState(AlarmKind.DeviationWarning));
        Assert.True(double.IsNaN(monitor.ShelvedUntilS(AlarmKind.DeviationWarning)));
    }

    [Fact]
    public void Unshelve_InactiveCondition_ReturnsToNormal()
    {
        var monitor = new ExcursionMonitor(Options());
        Feed(monitor, 0, 10, 608);
        monitor.Shelve(AlarmKind.DeviationWarning, 1000, 11);
        Feed(monitor, 12, 20, 600);
        monitor.Unshelve(AlarmKind.DeviationWarning, 21);
        Assert.Equal(AlarmState.Normal, monitor.GetState(AlarmKind.DeviationWarning));
        Assert.Throws<ArgumentOutOfRangeException>(() => monitor.Shelve(AlarmKind.Stale, 5, 21));
    }

    [Fact]
    public void Observe_PlateauAtExcursionTemperature_AddsExactlyDTimesDt()
    {
        // DERIVED (CHECKS §8): adding Δt at T_exc in place of T_set adds exactly (D(T_exc) − D(T_set))·Δt to ∫D dt.
        var d = new ArrheniusDiffusivity(3e-3, 1.2);
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), d, observer);
        var times = new List<double>();
        var readings = new List<double>();
        void Add(double t, double c)
        {
            times.Add(t);
            readings.Add(c);
            monitor.Observe(t, c, Setpoint);
        }
        for (int t = 0; t <= 100; t++)
        {
            Add(t, 600);
        }
        for (int t = 100; t <= 145; t++)
        {
            Add(t, 640); // a step at t = 100 (two samples at the same instant), 45 s at 640 °C
        }
        for (int t = 145; t <= 300; t++)
        {
            Add(t, 600);
        }
        ExcursionSummary summary = Assert.Single(observer.Excursions);
        double expected = (d.DiffusivityCmSqPerS(913.15) - d.DiffusivityCmSqPerS(873.15)) * 45;
        Assert.True(Math.Abs(summary.ExcessIntegralCmSq / expected - 1) < 1e-12, $"{summary.ExcessIntegralCmSq} vs {expected}");
        Assert.Equal(45, summary.DurationS);

        // Its effect on L: L_eff of the record minus L_eff with the excursion replaced by the setpoint.
        double actual = ThermalIntegrator.Integrate(times.ToArray(), readings.ToArray(), TemperatureCalibration.Identity, d, 0, 300, 10).IntegralCmSq;
        double flat = d.DiffusivityCmSqPerS(873.15) * 300;
        double expectedChange = DiffusionLength.LengthUm(actual, 1) - DiffusionLength.LengthUm(flat, 1);
        Assert.Equal(expectedChange, summary.LengthChangeUm(actual, 1), Math.Abs(expectedChange) * 1e-9);
        Assert.True(summary.LengthChangeUm(actual, 1) > 0);
    }

    [Fact]
    public void Observe_RampedExcursion_ExcessEqualsRecordDifference()
    {
        // Reference: the integrator run on the record and on the same record with excursion samples set to the setpoint.
        var d = new ArrheniusDiffusivity(3e-3, 1.2);
        var observer = new RecordingObserver();
        var monitor = new ExcursionMonitor(Options(), d, observer);
        int n = 600;
        var times = new double[n];
        var actual = new double[n];
        var replaced = new double[n];
        for (int i = 0; i < n; i++)
        {
            times[i] = i * 0.5;
            double bump = times[i] is > 100 and < 200 ? 12 * Math.Sin(Math.PI * (times[i] - 100) / 100) : 0;
            actual[i] = Setpoint + bump;
            monitor.Observe(times[i], actual[i], Setpoint);
        }
        ExcursionSummary summary = Assert.Single(observer.Excursions);
        for (int i = 0; i < n; i++)
        {
            replaced[i] = times[i] >= summary.StartS && times[i] < summary.EndS ? Setpoint : actual[i];
        }
        double withExcursion = ThermalIntegrator.Integrate(times, actual, TemperatureCalibration.Identity, d, 0, times[^1], 10).IntegralCmSq;
        double withSetpoint = ThermalIntegrator.Integrate(times, replaced, TemperatureCalibration.Identity, d, 0, times[^1], 10).IntegralCmSq;
        Assert.Equal(withExcursion - withSetpoint, summary.ExcessIntegralCmSq, Math.Abs(withExcursion - withSetpoint) * 1e-9);
        Assert.Equal(12, summary.PeakDeviationK, 0.05);
    }

    [Fact]
    public void Observe_TimeGoesBackwards_RejectsSample()
    {
        var monitor = new ExcursionMonitor(Options());
        Assert.True(monitor.Observe(10, 600, Setpoint));
        Assert.False(monitor.Observe(9, 600, Setpoint));
        Assert.False(monitor.Observe(11, double.NaN, Setpoint));
        Assert.Equal(2, monitor.RejectedSamples);
    }

    [Fact]
    public void EndRun_OpenExcursion_IsReportedAsNotClosed()
    {
        var observer = new RecordingObserver();
        // Off setpoint from the first sample is a ramp under the state-based rule; this test is about closing at run end.
        var options = Options();
        options.DeviationAlarming = DeviationAlarmRule.Always;
        var monitor = new ExcursionMonitor(options, observer: observer);
        monitor.BeginRun(0);
        Feed(monitor, 0, 30, 610);
        monitor.EndRun(31);
        ExcursionSummary summary = Assert.Single(observer.Excursions);
        Assert.False(summary.Closed);
        Assert.Equal(31, summary.EndS);
        Assert.Equal(AlarmState.ReturnedToNormalUnacknowledged, monitor.GetState(AlarmKind.DeviationWarning));
    }

    [Fact]
    public void Observe_LongStream_AllocatesNothing()
    {
        var options = Options();
        options.MaxRateKPerS = 3;
        options.HighLimitC = 640;
        options.FlatlineWindow = TimeSpan.FromSeconds(60);
        var observer = new CountingObserver();
        var monitor = new ExcursionMonitor(options, new ArrheniusDiffusivity(1e-2, 1.5), observer);
        monitor.BeginRun(0);
        Stream(monitor, 0, 1000); // warm up (JIT)
        long before = GC.GetAllocatedBytesForCurrentThread();
        Stream(monitor, 1000, 200_000);
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.True(observer.Excursions > 10, $"only {observer.Excursions} excursions: the stream should exercise the engine");
        Assert.Equal(0, allocated);
    }

    private static void Stream(ExcursionMonitor monitor, int from, int to)
    {
        for (int i = from; i < to; i++)
        {
            double t = i * 0.1;
            double value = Setpoint + 20 * Math.Sin(t / 30) * Math.Sin(t / 7);
            monitor.Observe(t, value, Setpoint);
            if (i % 10 == 0)
            {
                monitor.Tick(t);
            }
        }
    }
}
