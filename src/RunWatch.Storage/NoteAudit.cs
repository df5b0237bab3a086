namespace RunWatch.Storage;

/// <summary>The audit entry written with each note, the same on every store.</summary>
internal static class NoteAudit
{
    public const string Action = "note added";

    public static string SubjectName(NoteSubject subject) => subject == NoteSubject.Run ? "run" : "wafer";

    public static NoteSubject Parse(string stored) => stored == "run" ? NoteSubject.Run : NoteSubject.Wafer;

    public static AuditEntry For(EngineerNote note, long id) =>
        new(note.WrittenAt, note.Author, Action, $"{SubjectName(note.Subject)} {note.SubjectId} (note {id})", AuditDetail.Json(note.Text));

    /// <summary>Throws when the note cannot be stored.</summary>
    public static void Check(EngineerNote note)
    {
        ArgumentNullException.ThrowIfNull(note);
        if (note.Problem() is { } problem)
        {
            throw new ArgumentException(problem, nameof(note));
        }
    }
}
