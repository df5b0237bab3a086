namespace RunWatch.Storage;

/// <summary>A note an engineer wrote on a run or a wafer. Plain text; the store keeps it as written.</summary>
/// <param name="Id">Store id; 0 before it is stored.</param>
/// <param name="Subject">Run or wafer.</param>
/// <param name="SubjectId">The run's or wafer's name.</param>
/// <param name="Text">What was written, at most <see cref="MaxLength"/> characters.</param>
/// <param name="Author">Who wrote it.</param>
/// <param name="WrittenAt">When.</param>
public sealed record EngineerNote(long Id, NoteSubject Subject, string SubjectId, string Text, string Author, DateTimeOffset WrittenAt)
{
    /// <summary>Longest note kept, characters: a paragraph or two, not a report.</summary>
    public const int MaxLength = 2000;

    /// <summary>Longest run or wafer name a note may name.</summary>
    public const int MaxSubjectIdLength = 128;

    /// <summary>Why the note cannot be stored, or null when it can.</summary>
    public string? Problem()
    {
        if (!Enum.IsDefined(Subject))
        {
            return "a note is about a run or a wafer";
        }
        if (string.IsNullOrWhiteSpace(SubjectId) || SubjectId.Length > MaxSubjectIdLength)
        {
            return $"a note needs the {Subject.ToString().ToLowerInvariant()}'s name (1–{MaxSubjectIdLength} characters)";
        }
        if (string.IsNullOrWhiteSpace(Text))
        {
            return "the note is empty";
        }
        if (Text.Length > MaxLength)
        {
            return $"the note has {Text.Length} characters; at most {MaxLength} are kept";
        }
        if (string.IsNullOrWhiteSpace(Author))
        {
            return "a note needs its author";
        }
        return null;
    }
}
