using RunWatch.Core.Excursions;

namespace RunWatch.Core.Tests.Excursions;

/// <summary>Keeps every transition and summary a monitor reports.</summary>
internal sealed class RecordingObserver : IExcursionObserver
{
    public List<AlarmTransition> Transitions { get; } = [];

    public List<ExcursionSummary> Excursions { get; } = [];

    public void OnAlarmChanged(in AlarmTransition transition) => Transitions.Add(transition);

    public void OnExcursionEnded(in ExcursionSummary summary) => Excursions.Add(summary);

    public IEnumerable<AlarmTransition> Of(AlarmKind kind) => Transitions.Where(t => t.Kind == kind);
}
