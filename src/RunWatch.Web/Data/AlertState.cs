namespace RunWatch.Web.Data;

/// <summary>Alarm states in the vocabulary of ISA-18.2 (alarm management).</summary>
public enum AlertState
{
    ActiveUnacknowledged,
    ActiveAcknowledged,
    ReturnedUnacknowledged,
    Shelved,
    Normal,
}
