using Npgsql;

namespace RunWatch.Storage.Postgres;

/// <summary>Engineers' notes on runs and wafers, each with its audit entry.</summary>
public sealed partial class PostgresRunWatchStore : INoteStore
{
    /// <inheritdoc />
    public Task<EngineerNote> AddNoteAsync(EngineerNote note, CancellationToken cancellationToken)
    {
        NoteAudit.Check(note);
        return WriteAsync(async (connection, transaction) =>
        {
            await using var insert = new NpgsqlCommand("""
                INSERT INTO engineer_notes (subject, subject_id, body, author, written_us) VALUES (@subject, @id, @body, @author, @t) RETURNING id
                """, connection, transaction);
            PgParameters.Text(insert, "subject", NoteAudit.SubjectName(note.Subject));
            PgParameters.Text(insert, "id", note.SubjectId);
            PgParameters.Text(insert, "body", note.Text);
            PgParameters.Text(insert, "author", note.Author);
            PgParameters.Micros(insert, "t", note.WrittenAt);
            long id = (long)(await insert.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false))!;
            await InsertAuditAsync(connection, transaction, NoteAudit.For(note, id), cancellationToken).ConfigureAwait(false);
            return note with { Id = id };
        }, cancellationToken);
    }

    /// <inheritdoc />
    public Task<IReadOnlyList<EngineerNote>> GetNotesAsync(NoteSubject subject, string subjectId, int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<EngineerNote>>(async connection =>
        {
            await using var command = new NpgsqlCommand("""
                SELECT id, body, author, written_us FROM engineer_notes WHERE subject = @subject AND subject_id = @id
                ORDER BY written_us DESC, id DESC LIMIT @max
                """, connection);
            PgParameters.Text(command, "subject", NoteAudit.SubjectName(subject));
            PgParameters.Text(command, "id", subjectId);
            PgParameters.Int(command, "max", Math.Max(0, maxCount));
            await using var r = await command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            var list = new List<EngineerNote>();
            while (await r.ReadAsync(cancellationToken).ConfigureAwait(false))
            {
                list.Add(new EngineerNote(r.GetInt64(0), subject, subjectId, r.GetString(1), r.GetString(2), UnixMicros.ToDateTimeOffset(r.GetInt64(3))));
            }
            return list;
        }, cancellationToken);
}
