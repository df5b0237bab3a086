namespace RunWatch.Storage;

/// <summary>What an engineer's note is about.</summary>
public enum NoteSubject
{
    /// <summary>A growth run (subject id: the run's name).</summary>
    Run,

    /// <summary>A wafer (subject id: the wafer's name).</summary>
    Wafer,
}
