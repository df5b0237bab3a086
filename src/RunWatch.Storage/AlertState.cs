namespace RunWatch.Storage;

/// <summary>Alarm states after ISA-18.2 (the state names of the standard's state diagram, simplified).</summary>
public enum AlertState
{
    /// <summary>Condition cleared and acknowledged: the alert's life is over.</summary>
    Normal = 0,

    /// <summary>Condition active, not yet acknowledged by an operator.</summary>
    Unacknowledged,

    /// <summary>Condition active, acknowledged.</summary>
    Acknowledged,

    /// <summary>Condition cleared by itself before anyone acknowledged it (return to normal, unacknowledged).</summary>
    ReturnedUnacknowledged,

    /// <summary>Shelved by an operator: kept out of the active list until unshelved or the shelf time ends.</summary>
    Shelved,
}
