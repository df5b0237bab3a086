namespace RunWatch.Storage.Sqlite;

/// <summary>Engineers' notes on runs and wafers, each with its audit entry.</summary>
public sealed partial class SqliteRunWatchStore : INoteStore
{
    /// <inheritdoc />
    public Task<EngineerNote> AddNoteAsync(EngineerNote note, CancellationToken cancellationToken)
    {
        NoteAudit.Check(note);
        return WriteAsync(connection =>
        {
            using var transaction = connection.BeginTransaction();
            using var insert = connection.CreateCommand();
            insert.Transaction = transaction;
            insert.CommandText = """
                INSERT INTO engineer_notes (subject, subject_id, body, author, written_us) VALUES ($subject, $id, $body, $author, $t);
                SELECT last_insert_rowid();
                """;
            insert.Parameters.AddWithValue("$subject", NoteAudit.SubjectName(note.Subject));
            insert.Parameters.AddWithValue("$id", note.SubjectId);
            insert.Parameters.AddWithValue("$body", note.Text);
            insert.Parameters.AddWithValue("$author", note.Author);
            insert.Parameters.AddWithValue("$t", UnixMicros.From(note.WrittenAt));
            long id = (long)insert.ExecuteScalar()!;
            InsertAudit(connection, transaction, NoteAudit.For(note, id));
            transaction.Commit();
            return note with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<EngineerNote>> GetNotesAsync(NoteSubject subject, string subjectId, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<EngineerNote>>(connection =>
        {
            using var command = connection.CreateCommand();
            command.CommandText = """
                SELECT id, body, author, written_us FROM engineer_notes WHERE subject = $subject AND subject_id = $id
                ORDER BY written_us DESC, id DESC LIMIT $max
                """;
            command.Parameters.AddWithValue("$subject", NoteAudit.SubjectName(subject));
            command.Parameters.AddWithValue("$id", subjectId);
            command.Parameters.AddWithValue("$max", Math.Max(0, maxCount));
            using var r = command.ExecuteReader();
            var list = new List<EngineerNote>();
            while (r.Read())
            {
                list.Add(new EngineerNote(r.GetInt64(0), subject, subjectId, r.GetString(1), r.GetString(2), UnixMicros.ToDateTimeOffset(r.GetInt64(3))));
            }
            return list;
        }, cancellationToken);
}
