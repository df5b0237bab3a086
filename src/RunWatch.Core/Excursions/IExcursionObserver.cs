namespace RunWatch.Core.Excursions;

/// <summary>Receives what an <see cref="ExcursionMonitor"/> finds. Called synchronously on the feeding thread.</summary>
public interface IExcursionObserver
{
    /// <summary>An alarm changed state.</summary>
    void OnAlarmChanged(in AlarmTransition transition);

    /// <summary>An excursion ended (or was closed by the end of the run or of the data).</summary>
    void OnExcursionEnded(in ExcursionSummary summary);
}
