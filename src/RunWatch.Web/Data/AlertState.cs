namespace RunWatch.Web.Data;

/// <summary>Alarm states in the vocabulary of ISA-18.2 (alarm management).</summary>
public enum AlertState
{
    ActiveUnacknowledged,
    ActiveAcknowledged,
    ReturnedUnacknowledged,
    Shelved,
    Normal,

    /// <summary>Condition active in a state where the alarm is suppressed by design (a ramp): recorded, not raised, nothing to do.</summary>
    Suppressed,
}
