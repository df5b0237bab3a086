namespace RunWatch.Storage;

/// <summary>How urgent an alert is.</summary>
public enum AlertSeverity
{
    /// <summary>For information.</summary>
    Low = 0,

    /// <summary>Needs attention during the run.</summary>
    Medium,

    /// <summary>Needs attention now.</summary>
    High,
}
