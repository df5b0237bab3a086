namespace RunWatch.Storage;

/// <summary>
/// Engineers' notes on runs and wafers. Each note is written together with its audit entry (who, when, what) in
/// one transaction; notes are never edited or deleted. Thread-safe.
/// </summary>
public interface INoteStore
{
    /// <summary>Stores the note (its <see cref="EngineerNote.Id"/> is ignored) with an audit entry "note added"; returns it with its id.</summary>
    /// <exception cref="ArgumentException">The note is empty, too long, or names no subject (<see cref="EngineerNote.Problem"/>).</exception>
    Task<EngineerNote> AddNoteAsync(EngineerNote note, CancellationToken cancellationToken);

    /// <summary>The notes on one run or wafer, newest first (ties: the later stored first).</summary>
    Task<IReadOnlyList<EngineerNote>> GetNotesAsync(NoteSubject subject, string subjectId, int maxCount, CancellationToken cancellationToken);
}
