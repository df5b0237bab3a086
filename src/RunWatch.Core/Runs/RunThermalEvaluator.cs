using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Runs;

/// <summary>
/// The one evaluation of a run's thermal record, used by the daemon at run end and by <c>runwatch thermal</c>:
/// L_nom, L_eff, T_eff and coverage over the growth window (<see cref="DiffusionLengthCalculator"/>), and the
/// excursions found by replaying the whole record through a fresh <see cref="ExcursionMonitor"/>, each with its
/// effect on L_eff limited to the growth window (<see cref="ExcursionWindowEffect"/>). Pure and thread-safe.
/// </summary>
public static class RunThermalEvaluator
{
    /// <exception cref="ArgumentException">Invalid options, process parameters, window, or setpoints of the wrong length.</exception>
    public static RunThermalEvaluation Evaluate(RunThermalInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        ThermalRecord record = input.Record;
        if (input.SetpointsC.Length != record.Count)
        {
            throw new ArgumentException($"{input.SetpointsC.Length} setpoints for {record.Count} samples.");
        }
        DiffusionLengthResult length = DiffusionLengthCalculator.Compute(record, input.Diffusivity, input.Window, input.Length, input.Calibration, input.Plan);
        if (record.Count == 0)
        {
            return new RunThermalEvaluation(length, [], []);
        }

        double[] times = record.TimesS.ToArray();
        var trueC = new double[times.Length];
        ReadOnlySpan<double> readings = record.ReadingsC;
        for (int i = 0; i < trueC.Length; i++)
        {
            trueC[i] = input.Calibration.ToTrueC(readings[i]);
        }

        var collector = new Collector();
        var monitor = new ExcursionMonitor(input.Excursions, input.Diffusivity, collector);
        GrowthWindow window = input.Window;
        monitor.BeginRun(times[0]);
        for (int i = 0; i < times.Length; i++)
        {
            // As live: the growth window is the Growth state, where deviation alarms are never suppressed by design.
            monitor.SetGrowth(times[i] >= window.StartS && times[i] < window.EndS, times[i]);
            monitor.Observe(times[i], trueC[i], input.SetpointsC[i]);
        }
        monitor.EndRun(times[^1]);

        double c = input.Length.ConventionFactor;
        double maxGapS = input.Excursions.MaxGap.TotalSeconds;
        var effects = new List<RunExcursionEffect>(collector.Excursions.Count);
        foreach (ExcursionSummary e in collector.Excursions)
        {
            // L_eff integrates the growth window only: the heating ramp or a pre-bake outside it changes nothing.
            bool inWindow = Math.Min(e.EndS, window.EndS) > Math.Max(e.StartS, window.StartS);
            // The excursion's effect includes the segment leading into its first sample, as the monitor counts it.
            int first = Array.BinarySearch(times, e.StartS);
            double leadInS = first > 0 ? times[first - 1] : e.StartS;
            double excess = ExcursionWindowEffect.ExcessIntegralCmSq(times, trueC, input.SetpointsC, leadInS, e.EndS, window.StartS, window.EndS, input.Diffusivity, maxGapS);
            effects.Add(new RunExcursionEffect(e, inWindow, DiffusionLength.LengthChangeUm(length.IntegralCmSq, excess, c)));
        }
        return new RunThermalEvaluation(length, effects, collector.OtherAlarms);
    }

    private sealed class Collector : IExcursionObserver
    {
        public List<ExcursionSummary> Excursions { get; } = [];

        public List<AlarmTransition> OtherAlarms { get; } = [];

        public void OnAlarmChanged(in AlarmTransition transition)
        {
            if (transition.To == AlarmState.ActiveUnacknowledged && transition.Kind is not (AlarmKind.DeviationWarning or AlarmKind.DeviationAlarm))
            {
                OtherAlarms.Add(transition);
            }
        }

        public void OnExcursionEnded(in ExcursionSummary summary) => Excursions.Add(summary);
    }
}
