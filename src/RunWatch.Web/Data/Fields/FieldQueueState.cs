namespace RunWatch.Web.Data.Fields;

/// <summary>Where one SEM field stands in the analysis queue, as the Fields screen shows it.</summary>
public enum FieldQueueState
{
    /// <summary>Matched to a wafer and waiting for the analysis.</summary>
    Queued,

    /// <summary>Being analysed now.</summary>
    Running,

    /// <summary>Analysed; its results are on the wafer page.</summary>
    Done,

    /// <summary>The analysis failed; the reason says why (the file stays in the drop folder).</summary>
    Failed,

    /// <summary>Refused at intake (link, empty file, bad sidecar...); the reason says why.</summary>
    Refused,

    /// <summary>Stored, but no wafer or no run yet: waits for a person to assign it.</summary>
    WaitingForWafer,
}
