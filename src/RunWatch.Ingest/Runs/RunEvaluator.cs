using System.Text.Json;
using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// Thermal figures of a closed run from its stored record: L_nom, L_eff, T_eff and coverage over the growth window
/// (Core <see cref="DiffusionLengthCalculator"/>), and the excursions found by replaying the record through a fresh
/// Core <see cref="ExcursionMonitor"/>, each with its effect on L_eff.
/// </summary>
internal sealed class RunEvaluator(IRunWatchStore store)
{
    private const int MaxSamples = 5_000_000;

    public async Task<RunRecord> EvaluateAsync(RunRecord run, ChamberRuntime chamber, CancellationToken cancellationToken)
    {
        var end = run.EndedAt ?? run.StartedAt;
        var temperature = chamber.GrowthTemperature;
        if (temperature is null)
        {
            return run with { SummaryJson = Error("the chamber has no GrowthTemperature channel") };
        }
        var readings = await store.GetSamplesAsync(chamber.Name, temperature.Name, run.StartedAt, end.AddTicks(10), MaxSamples, cancellationToken).ConfigureAwait(false);
        if (readings.Count < 2)
        {
            return run with { Coverage = 0, SummaryJson = Error("fewer than two temperature samples in the run") };
        }
        var setpoints = chamber.Setpoint is { } sp
            ? await store.GetSamplesAsync(chamber.Name, sp.Name, run.StartedAt, end.AddTicks(10), MaxSamples, cancellationToken).ConfigureAwait(false)
            : [];
        var shutter = chamber.GrowthShutter is { } sh
            ? await store.GetSamplesAsync(chamber.Name, sh.Name, run.StartedAt, end.AddTicks(10), MaxSamples, cancellationToken).ConfigureAwait(false)
            : [];

        var origin = run.StartedAt;
        var times = new double[readings.Count];
        var values = new double[readings.Count];
        for (int i = 0; i < readings.Count; i++)
        {
            times[i] = Seconds(readings[i].Timestamp, origin);
            values[i] = readings[i].Value;
        }
        var record = new ThermalRecord(temperature.Name, times, values, origin);
        var window = GrowthWindowFrom(shutter, origin, Seconds(end, origin), chamber.Options.Runs.ShutterOpenAtOrAbove);
        var diffusivity = chamber.Options.Process.Diffusivity;
        var calibration = temperature.Calibration;
        double? setpointC = run.SetpointC ?? (setpoints.Count > 0 ? calibration.ToTrueC(setpoints[^1].Value) : null);
        GrowthPlan? plan = setpointC is { } s && run.PlannedSeconds is { } planned ? new GrowthPlan(s, planned) : null;
        var result = DiffusionLengthCalculator.Compute(record, diffusivity, window, chamber.Options.DiffusionLength, calibration, plan);

        var trueC = new double[times.Length];
        var setpointAt = new double[times.Length];
        SetpointsAtSamples(record, calibration, setpoints, origin, run.SetpointC, trueC, setpointAt);
        var excursions = Replay(chamber, record, trueC, setpointAt, diffusivity);
        double c = chamber.Options.DiffusionLength.ConventionFactor;
        double maxGapS = chamber.Options.Excursions.MaxGap.TotalSeconds;
        var excursionJson = new List<RunExcursionJson>(excursions.Count);
        foreach (var e in excursions)
        {
            // L_eff integrates the growth window only: the heating ramp or a pre-bake outside it changes nothing.
            bool inWindow = Math.Min(e.EndS, window.EndS) > Math.Max(e.StartS, window.StartS);
            // The excursion's effect includes the segment leading into its first sample, as the monitor counts it.
            int first = Array.BinarySearch(times, e.StartS);
            double leadInS = first > 0 ? times[first - 1] : e.StartS;
            double excess = ExcursionWindowEffect.ExcessIntegralCmSq(times, trueC, setpointAt, leadInS, e.EndS, window.StartS, window.EndS, diffusivity, maxGapS);
            excursionJson.Add(new RunExcursionJson(origin.AddSeconds(e.StartS), origin.AddSeconds(e.EndS), e.DurationS, e.PeakDeviationK, e.PeakValueC,
                e.Severity.ToString(), Finite(DiffusionLength.LengthChangeUm(result.IntegralCmSq, excess, c) * 1000.0), e.Closed, inWindow));
        }
        var summary = new RunSummaryJson(c, result.IntegralCmSq, result.CoveredS, window.StartS, window.EndS, result.Gaps.Count, result.IsComplete,
            Finite(result.LogSensitivityPerK), readings.Count, plan is not null, null);
        return run with
        {
            SetpointC = run.SetpointC ?? setpointC,
            LNomNm = result.NominalLengthUm is { } nominal ? nominal * 1000.0 : null,
            LEffNm = Finite(result.EffectiveLengthUm * 1000.0),
            TEffC = Finite(result.EffectiveTemperatureC),
            Coverage = result.CoveragePercent / 100.0,
            ExcursionsJson = JsonSerializer.Serialize(excursionJson, RunJsonContext.Default.ListRunExcursionJson),
            SummaryJson = JsonSerializer.Serialize(summary, RunJsonContext.Default.RunSummaryJson),
        };
    }

    /// <summary>The growth window: first shutter opening to its last closing inside the run, or the whole run without shutter data.</summary>
    internal static GrowthWindow GrowthWindowFrom(IReadOnlyList<SampleRecord> shutter, DateTimeOffset origin, double endS, double openAtOrAbove)
    {
        double start = double.NaN;
        double stop = endS;
        bool open = false;
        foreach (var s in shutter)
        {
            double t = Seconds(s.Timestamp, origin);
            bool isOpen = s.Value >= openAtOrAbove;
            if (isOpen && !open)
            {
                if (double.IsNaN(start))
                {
                    start = t;
                }
                stop = endS;
            }
            else if (!isOpen && open)
            {
                stop = t;
            }
            open = isOpen;
        }
        return double.IsNaN(start) ? new GrowthWindow(0, Math.Max(0, endS)) : new GrowthWindow(start, Math.Max(start, stop));
    }

    /// <summary>True temperature and the setpoint in force (announced, then the setpoint channel's latest) at each sample.</summary>
    private static void SetpointsAtSamples(ThermalRecord record, TemperatureCalibration calibration, IReadOnlyList<SampleRecord> setpoints,
        DateTimeOffset origin, double? announcedSetpointC, double[] trueC, double[] setpointAt)
    {
        var times = record.TimesS;
        var readings = record.ReadingsC;
        int next = 0;
        double setpoint = announcedSetpointC ?? double.NaN;
        for (int i = 0; i < times.Length; i++)
        {
            while (next < setpoints.Count && Seconds(setpoints[next].Timestamp, origin) <= times[i])
            {
                setpoint = calibration.ToTrueC(setpoints[next].Value);
                next++;
            }
            trueC[i] = calibration.ToTrueC(readings[i]);
            setpointAt[i] = setpoint;
        }
    }

    private static List<ExcursionSummary> Replay(ChamberRuntime chamber, ThermalRecord record, double[] trueC, double[] setpointAt, ArrheniusDiffusivity diffusivity)
    {
        var collector = new ExcursionCollector();
        var monitor = new ExcursionMonitor(chamber.Options.Excursions, diffusivity, collector);
        var times = record.TimesS;
        monitor.BeginRun(times[0]);
        for (int i = 0; i < times.Length; i++)
        {
            monitor.Observe(times[i], trueC[i], setpointAt[i]);
        }
        monitor.EndRun(times[^1]);
        return collector.Summaries;
    }

    private static double Seconds(DateTimeOffset t, DateTimeOffset origin) => (t - origin).Ticks / (double)TimeSpan.TicksPerSecond;

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;

    private static string Error(string message) => JsonSerializer.Serialize(
        new RunSummaryJson(0, 0, 0, 0, 0, 0, false, null, 0, false, message), RunJsonContext.Default.RunSummaryJson);

    private sealed class ExcursionCollector : IExcursionObserver
    {
        public List<ExcursionSummary> Summaries { get; } = [];

        public void OnAlarmChanged(in AlarmTransition transition)
        {
        }

        public void OnExcursionEnded(in ExcursionSummary summary) => Summaries.Add(summary);
    }
}
