using RunWatch.Core.Excursions;

namespace RunWatch.Core.Tests.Excursions;

/// <summary>Counts reports without allocating, for the allocation test.</summary>
internal sealed class CountingObserver : IExcursionObserver
{
    public int Transitions { get; private set; }

    public int Excursions { get; private set; }

    public void OnAlarmChanged(in AlarmTransition transition) => Transitions++;

    public void OnExcursionEnded(in ExcursionSummary summary) => Excursions++;
}
