namespace RunWatch.Core.Excursions;

/// <summary>The highest band an excursion crossed.</summary>
public enum ExcursionSeverity
{
    /// <summary>Beyond the warning band only.</summary>
    Warning = 0,

    /// <summary>Beyond the alarm band for at least the minimum duration.</summary>
    Alarm = 1,
}
