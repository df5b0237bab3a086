using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Runs;
using RunWatch.Core.Thermal;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// Thermal figures of a closed run from its stored record, by the one run evaluation that <c>runwatch thermal</c>
/// also uses (Core <see cref="RunThermalEvaluator"/>): L_nom, L_eff, T_eff and coverage over the growth window, and
/// the excursions of the whole run, each with its effect on L_eff. This class only reads the record from the store
/// and writes the figures back as the typed <see cref="RunThermalSummary"/> and <see cref="RunExcursionRecord"/>s.
/// </summary>
internal sealed class RunEvaluator(IRunWatchStore store, IRunDiffusivity? diffusivitySource = null, IRunDiffusionModels? diffusionModels = null)
{
    /// <summary>Fixed seed of the simulated wire sites: the same run and model give the same run-end figures.</summary>
    private const int EstimateSeed = 20_261_205;

    private const int MaxSamples = 5_000_000;
    private readonly IRunDiffusivity _diffusivity = diffusivitySource ?? new ConfiguredRunDiffusivity();

    public async Task<RunRecord> EvaluateAsync(RunRecord run, ChamberRuntime chamber, CancellationToken cancellationToken)
    {
        var end = run.EndedAt ?? run.StartedAt;
        var temperature = chamber.GrowthTemperature;
        if (temperature is null)
        {
            return run with { Summary = RunThermalSummary.Failed("the chamber has no GrowthTemperature channel") };
        }
        var readings = await store.GetSamplesAsync(chamber.Name, temperature.Name, run.StartedAt, end.AddTicks(10), MaxSamples, cancellationToken).ConfigureAwait(false);
        if (readings.Count < 2)
        {
            return run with { Coverage = 0, Summary = RunThermalSummary.Failed("fewer than two temperature samples in the run") };
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
        var diffusivity = await _diffusivity.ForRunAsync(chamber, run, cancellationToken).ConfigureAwait(false);
        var calibration = temperature.Calibration;
        double? setpointC = run.SetpointC ?? (setpoints.Count > 0 ? calibration.ToTrueC(setpoints[^1].Value) : null);
        GrowthPlan? plan = setpointC is { } s && run.PlannedSeconds is { } planned ? new GrowthPlan(s, planned) : null;
        var input = new RunThermalInput(record, SetpointsAtSamples(times, calibration, setpoints, origin, run.SetpointC), window, diffusivity, calibration,
            chamber.Options.DiffusionLength, chamber.Options.Excursions, plan);
        RunThermalEvaluation evaluation = RunThermalEvaluator.Evaluate(input);
        DiffusionLengthResult result = evaluation.Length;

        var excursions = new List<RunExcursionRecord>(evaluation.Excursions.Count);
        foreach (var (e, inWindow, changeUm) in evaluation.Excursions)
        {
            excursions.Add(new RunExcursionRecord(origin.AddSeconds(e.StartS), origin.AddSeconds(e.EndS), e.DurationS, e.PeakDeviationK, e.PeakValueC,
                e.Severity, Finite(changeUm * 1000.0), e.Closed, inWindow, e.SuppressedByDesign));
        }
        var summary = new RunThermalSummary(result.ConventionFactor, result.IntegralCmSq, result.CoveredS, window.StartS, window.EndS, result.Gaps.Count,
            result.IsComplete, Finite(result.LogSensitivityPerK), readings.Count, plan is not null, null)
        {
            Diffusion = await DiffusionFiguresAsync(run, record, calibration, window, setpointC, evaluation, cancellationToken).ConfigureAwait(false),
        };
        return run with
        {
            SetpointC = run.SetpointC ?? setpointC,
            LNomNm = result.NominalLengthUm is { } nominal ? nominal * 1000.0 : null,
            LEffNm = Finite(result.EffectiveLengthUm * 1000.0),
            TEffC = Finite(result.EffectiveTemperatureC),
            Coverage = result.CoveragePercent / 100.0,
            Excursions = excursions,
            Summary = summary,
        };
    }

    /// <summary>
    /// The accepted diffusion model's run-end figures for the run's process (its recipe), or null when the process has
    /// none accepted. A failure is recorded in the figures, never thrown: the run's other figures still stand.
    /// </summary>
    private async Task<RunDiffusionFigures?> DiffusionFiguresAsync(RunRecord run, ThermalRecord record, TemperatureCalibration calibration,
        GrowthWindow window, double? setpointC, RunThermalEvaluation evaluation, CancellationToken cancellationToken)
    {
        if (diffusionModels is null || string.IsNullOrWhiteSpace(run.Recipe))
        {
            return null;
        }
        if (await diffusionModels.AcceptedForAsync(run.Recipe, cancellationToken).ConfigureAwait(false) is not { } accepted)
        {
            return null;
        }
        if (setpointC is not { } setpoint)
        {
            return new RunDiffusionFigures(accepted.Id, null, null, null, null, false, [], "the run has no setpoint (announced or logged)");
        }
        var spans = new List<GrowthWindow>();
        foreach (RunExcursionEffect e in evaluation.Excursions)
        {
            if (e.InGrowthWindow)
            {
                spans.Add(new GrowthWindow(e.Summary.StartS, e.Summary.EndS));
            }
        }
        try
        {
            // Seconds of CPU on a 12 µm field: off the caller's thread, once per closed run.
            RunEndEstimate estimate = await Task.Run(() => RunEndEstimator.Estimate(accepted.Params.Model, record, calibration, window, setpoint, spans,
                accepted.Params.WireDensityPerUm2, EstimateSeed), cancellationToken).ConfigureAwait(false);
            var changes = new List<RunExcursionRadiusChange>(estimate.Excursions.Count);
            foreach (ExcursionRadiusEffect x in estimate.Excursions)
            {
                changes.Add(new RunExcursionRadiusChange(x.Excursion.StartS, x.Excursion.EndS, Finite(x.MeanRadiusChangeNm), Finite(x.LambdaEffChangeUm * 1000.0)));
            }
            return new RunDiffusionFigures(accepted.Id, Finite(estimate.LambdaAtSetpointUm * 1000.0), Finite(estimate.LambdaEffUm * 1000.0),
                Finite(estimate.MeanRadiusNm), Finite(estimate.RadiusSdNm), estimate.Extrapolated, changes, null);
        }
        catch (Exception ex) when (ex is ArgumentException or InvalidOperationException or ArithmeticException)
        {
            return new RunDiffusionFigures(accepted.Id, null, null, null, null, false, [], "the run-end estimate failed: " + ex.Message);
        }
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

    /// <summary>The setpoint in force at each sample, true °C: the announced one, then the setpoint channel's latest.</summary>
    private static double[] SetpointsAtSamples(double[] times, TemperatureCalibration calibration, IReadOnlyList<SampleRecord> setpoints,
        DateTimeOffset origin, double? announcedSetpointC)
    {
        var setpointAt = new double[times.Length];
        int next = 0;
        double setpoint = announcedSetpointC ?? double.NaN;
        for (int i = 0; i < times.Length; i++)
        {
            while (next < setpoints.Count && Seconds(setpoints[next].Timestamp, origin) <= times[i])
            {
                setpoint = calibration.ToTrueC(setpoints[next].Value);
                next++;
            }
            setpointAt[i] = setpoint;
        }
        return setpointAt;
    }

    private static double Seconds(DateTimeOffset t, DateTimeOffset origin) => (t - origin).Ticks / (double)TimeSpan.TicksPerSecond;

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
