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
}
