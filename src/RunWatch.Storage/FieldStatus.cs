namespace RunWatch.Storage;

/// <summary>Where an SEM field is in the wafer pipeline.</summary>
public enum FieldStatus
{
    /// <summary>No wafer id found, or the wafer has no run yet: waits for a person to assign it.</summary>
    Unassigned,

    /// <summary>Matched to a wafer and waiting in the analysis queue.</summary>
    Queued,

    /// <summary>Analysed; its latest analysis holds the results.</summary>
    Analysed,

    /// <summary>The analysis failed; <see cref="FieldRecord.Problem"/> says why.</summary>
    Failed,
}
