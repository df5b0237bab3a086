namespace RunWatch.Core.Excursions;

/// <summary>Alarm states in the vocabulary of ISA-18.2 / IEC 62682 (alarm management for the process industries).</summary>
public enum AlarmState
{
    /// <summary>Condition inactive and nothing left to acknowledge.</summary>
    Normal = 0,

    /// <summary>Condition active, not yet acknowledged by an operator.</summary>
    ActiveUnacknowledged = 1,

    /// <summary>Condition active, acknowledged.</summary>
    ActiveAcknowledged = 2,

    /// <summary>Condition returned to normal before anyone acknowledged it.</summary>
    ReturnedToNormalUnacknowledged = 3,

    /// <summary>Suppressed by an operator until an expiry time; the condition is still tracked.</summary>
    Shelved = 4,

    /// <summary>
    /// Condition active in a process state where the alarm is suppressed by design (state-based alarming, e.g. a
    /// deviation during a setpoint ramp): recorded, never raised, nothing to acknowledge. Distinct from
    /// <see cref="Shelved"/>, which is an operator's choice.
    /// </summary>
    SuppressedByDesign = 5,
}
