using RunWatch.Core.Excursions;
using RunWatch.Ingest.Chambers;

namespace RunWatch.Ingest.Alerts;

/// <summary>The live Core excursion monitor of one chamber and the transitions it reported since the last drain.</summary>
internal sealed class ChamberAlarms : IExcursionObserver
{
    public ChamberAlarms(ChamberRuntime chamber)
    {
        Chamber = chamber;
        Monitor = new ExcursionMonitor(chamber.Options.Excursions, chamber.Options.Process.Diffusivity, this);
    }

    public ChamberRuntime Chamber { get; }

    public ExcursionMonitor Monitor { get; }

    /// <summary>Latest setpoint from the setpoint channel, true °C (NaN until one arrives).</summary>
    public double ChannelSetpointC { get; set; } = double.NaN;

    /// <summary>Setpoint announced by the open run's start event, °C (NaN when none).</summary>
    public double RunSetpointC { get; set; } = double.NaN;

    public double SetpointC => double.IsNaN(ChannelSetpointC) ? RunSetpointC : ChannelSetpointC;

    public List<AlarmTransition> Pending { get; } = [];

    public void OnAlarmChanged(in AlarmTransition transition) => Pending.Add(transition);

    public void OnExcursionEnded(in ExcursionSummary summary)
    {
        // Live summaries are not kept: the run evaluator recomputes them from the stored record at run end.
    }
}
