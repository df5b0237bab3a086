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

    /// <summary>
    /// Condition active in a process state where the alarm is suppressed by design (a deviation on a setpoint ramp):
    /// recorded for the record, never raised to operators or sinks, nothing to acknowledge. Not an operator's choice
    /// (that is <see cref="Shelved"/>).
    /// </summary>
    Suppressed,
}
