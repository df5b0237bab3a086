namespace RunWatch.Core.Excursions;

/// <summary>The conditions an <see cref="ExcursionMonitor"/> watches on one channel; each has its own alarm.</summary>
public enum AlarmKind
{
    /// <summary>|reading − setpoint| beyond the warning band for at least the minimum duration.</summary>
    DeviationWarning = 0,

    /// <summary>|reading − setpoint| beyond the alarm band for at least the minimum duration.</summary>
    DeviationAlarm = 1,

    /// <summary>Reading above the absolute high limit.</summary>
    HighLimit = 2,

    /// <summary>Reading below the absolute low limit.</summary>
    LowLimit = 3,

    /// <summary>Rate of change beyond the limit.</summary>
    RateOfChange = 4,

    /// <summary>No sample for longer than the stale limit while a run is active.</summary>
    Stale = 5,

    /// <summary>The reading stays within ε for the whole flatline window while a run is active (a stuck sensor).</summary>
    Flatline = 6,
}
