namespace RunWatch.Storage.Tests.Contract;

/// <summary>The <see cref="INoteStore"/> contract on SQLite and PostgreSQL: newest first, per subject, audited, kept across a reopen, refusals store nothing.</summary>
public sealed class NoteStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Theory]
    [AllStores]
    public async Task AddNoteAsync_SeveralSubjects_ReadsNewestFirstPerSubjectWithOneAuditEach(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);

        var first = await db.Notes.AddNoteAsync(new EngineerNote(0, NoteSubject.Run, "R-0101", "Shutter stuck for 20 s at growth start.", "ada-engineer", T0), CancellationToken.None);
        await db.Notes.AddNoteAsync(new EngineerNote(0, NoteSubject.Wafer, "R-0101", "same name, other subject", "bo-engineer", T0.AddMinutes(1)), CancellationToken.None);
        await db.Notes.AddNoteAsync(new EngineerNote(0, NoteSubject.Run, "R-0101", "Re-run planned <b>Tuesday</b> & checked.", "bo-engineer", T0.AddMinutes(2)), CancellationToken.None);
        await db.Notes.AddNoteAsync(new EngineerNote(0, NoteSubject.Run, "R-0102", "other run", "bo-engineer", T0.AddMinutes(3)), CancellationToken.None);
        await db.ReopenAsync();
        var runNotes = await db.Notes.GetNotesAsync(NoteSubject.Run, "R-0101", 10, CancellationToken.None);
        var limited = await db.Notes.GetNotesAsync(NoteSubject.Run, "R-0101", 1, CancellationToken.None);
        var waferNotes = await db.Notes.GetNotesAsync(NoteSubject.Wafer, "R-0101", 10, CancellationToken.None);
        var none = await db.Notes.GetNotesAsync(NoteSubject.Wafer, "W-none", 10, CancellationToken.None);
        var audit = await db.Store.GetAuditAsync(10, CancellationToken.None);

        Assert.True(first.Id > 0);
        Assert.Equal(["Re-run planned <b>Tuesday</b> & checked.", "Shutter stuck for 20 s at growth start."], runNotes.Select(n => n.Text));
        Assert.Equal(("bo-engineer", T0.AddMinutes(2)), (runNotes[0].Author, runNotes[0].WrittenAt)); // stored as written, text not HTML
        Assert.Equal(first.Id, runNotes[1].Id);
        Assert.Single(limited);
        Assert.Equal("same name, other subject", Assert.Single(waferNotes).Text);
        Assert.Empty(none);
        Assert.Equal(4, audit.Count(a => a.Action == "note added"));
        Assert.Equal("run R-0102 (note " + (first.Id + 3) + ")", audit[0].Subject);
        Assert.Equal("other run", AuditDetail.Text(audit[0].DetailJson));
        Assert.Equal("bo-engineer", audit[0].Actor);
    }

    [Theory]
    [AllStores]
    public async Task AddNoteAsync_EmptyTooLongOrWithoutAuthor_RefusedAndNothingStored(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);

        var tooLong = new string('x', EngineerNote.MaxLength + 1);
        var refusals = new List<string>();
        foreach (var bad in new[]
        {
            new EngineerNote(0, NoteSubject.Wafer, "W-1", "   ", "ada-engineer", T0),
            new EngineerNote(0, NoteSubject.Wafer, "W-1", tooLong, "ada-engineer", T0),
            new EngineerNote(0, NoteSubject.Wafer, "W-1", "fine", " ", T0),
            new EngineerNote(0, NoteSubject.Wafer, "", "fine", "ada-engineer", T0),
            new EngineerNote(0, (NoteSubject)7, "W-1", "fine", "ada-engineer", T0),
        })
        {
            refusals.Add((await Assert.ThrowsAsync<ArgumentException>(() => db.Notes.AddNoteAsync(bad, CancellationToken.None))).Message);
        }
        var longest = await db.Notes.AddNoteAsync(new EngineerNote(0, NoteSubject.Wafer, "W-1", new string('y', EngineerNote.MaxLength), "ada-engineer", T0), CancellationToken.None);

        Assert.Contains("empty", refusals[0], StringComparison.Ordinal);
        Assert.Contains($"{EngineerNote.MaxLength + 1} characters", refusals[1], StringComparison.Ordinal);
        Assert.Contains("author", refusals[2], StringComparison.Ordinal);
        Assert.Contains("wafer's name", refusals[3], StringComparison.Ordinal);
        Assert.Equal(1, await db.CountAsync("SELECT COUNT(*) FROM engineer_notes"));
        Assert.Equal(1, await db.CountAsync("SELECT COUNT(*) FROM audit_entries WHERE action = 'note added'"));
        Assert.Equal(EngineerNote.MaxLength, (await db.Notes.GetNotesAsync(NoteSubject.Wafer, "W-1", 5, CancellationToken.None))[0].Text.Length);
        Assert.True(longest.Id > 0);
    }
}
