using Bunit;
using Microsoft.Extensions.DependencyInjection;
using RunWatch.Storage;
using RunWatch.Web.Components.Notes;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Fields;

/// <summary>Notes on a run or wafer over a real SQLite store: added by engineers, newest first, as text, audited; viewers read only.</summary>
public sealed class NotesPanelTests
{
    [Fact]
    public async Task Add_Engineer_NewestFirstAsTextAndAudited()
    {
        using var store = new StoreHarness();
        using var ctx = new DashboardTestContext();
        ctx.Services.AddSingleton<INoteStore>(store.Store);
        var panel = ctx.Render<NotesPanel>(p => p.Add(n => n.Subject, NoteSubject.Wafer).Add(n => n.SubjectId, "W-2030-A"));
        Assert.NotNull(panel.Find("[data-testid=no-notes]"));

        panel.Find("[data-testid=note-text]").Input("<script>alert(1)</script> first");
        panel.Find("[data-testid=note-add]").Click();
        ctx.Time.Advance(TimeSpan.FromMinutes(3));
        panel.Find("[data-testid=note-text]").Input("second\nwith a second line");
        panel.Find("[data-testid=note-add]").Click();

        var notes = panel.FindAll("[data-testid=note]");
        Assert.Equal(2, notes.Count);
        Assert.Contains("second", notes[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("test-engineer", notes[0].TextContent, StringComparison.Ordinal);
        Assert.Contains("<script>alert(1)</script> first", notes[1].QuerySelector(".note-text")!.TextContent, StringComparison.Ordinal);
        Assert.Empty(panel.FindAll("[data-testid=note] script"));
        Assert.Contains("&lt;script&gt;", panel.Markup, StringComparison.Ordinal);
        Assert.Equal("", panel.Find("[data-testid=note-text]").GetAttribute("value") ?? "");
        var audit = await store.Store.GetAuditAsync(10, CancellationToken.None);
        Assert.Equal(2, audit.Count(a => a.Action == "note added" && a.Actor == "test-engineer" && a.Subject!.StartsWith("wafer W-2030-A", StringComparison.Ordinal)));
        Assert.Equal(DashboardTestContext.Now.AddMinutes(3), (await store.Store.GetNotesAsync(NoteSubject.Wafer, "W-2030-A", 1, CancellationToken.None))[0].WrittenAt);
    }

    [Fact]
    public async Task Add_EmptyOrTooLong_RefusedTextKeptNothingStored()
    {
        using var store = new StoreHarness();
        using var ctx = new DashboardTestContext();
        ctx.Services.AddSingleton<INoteStore>(store.Store);
        var panel = ctx.Render<NotesPanel>(p => p.Add(n => n.Subject, NoteSubject.Run).Add(n => n.SubjectId, "R-2030"));

        panel.Find("[data-testid=note-text]").Input("   ");
        panel.Find("[data-testid=note-add]").Click();
        string empty = panel.Find("[data-testid=note-message]").TextContent;
        string tooLong = new('x', EngineerNote.MaxLength + 5);
        panel.Find("[data-testid=note-text]").Input(tooLong);
        panel.Find("[data-testid=note-add]").Click();

        Assert.StartsWith("Not saved: the note is empty", empty, StringComparison.Ordinal);
        Assert.Contains($"{EngineerNote.MaxLength + 5} characters; at most {EngineerNote.MaxLength}", panel.Find("[data-testid=note-message]").TextContent, StringComparison.Ordinal);
        Assert.Equal(tooLong, panel.Find("[data-testid=note-text]").GetAttribute("value"));
        Assert.Empty(await store.Store.GetNotesAsync(NoteSubject.Run, "R-2030", 10, CancellationToken.None));
        Assert.Equal(EngineerNote.MaxLength.ToString(System.Globalization.CultureInfo.InvariantCulture), panel.Find("[data-testid=note-text]").GetAttribute("maxlength"));
    }

    [Fact]
    public async Task Render_Viewer_ReadsNotesButCannotAdd()
    {
        using var store = new StoreHarness();
        await store.Store.AddNoteAsync(new EngineerNote(0, NoteSubject.Run, "R-2030", "checked the shutter log", "ada-engineer", DashboardTestContext.Now), CancellationToken.None);
        using var ctx = new DashboardTestContext(role: "viewer");
        ctx.Services.AddSingleton<INoteStore>(store.Store);
        var panel = ctx.Render<NotesPanel>(p => p.Add(n => n.Subject, NoteSubject.Run).Add(n => n.SubjectId, "R-2030"));

        Assert.NotNull(panel.Find("[data-testid=notes-read-only]"));
        Assert.Empty(panel.FindAll("[data-testid=note-text]"));
        Assert.Contains("checked the shutter log", panel.Find("[data-testid=note]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Render_NoNoteStore_SaysNotAvailable()
    {
        using var ctx = new DashboardTestContext();
        var panel = ctx.Render<NotesPanel>(p => p.Add(n => n.Subject, NoteSubject.Run).Add(n => n.SubjectId, "R-2030"));
        Assert.NotNull(panel.Find("[data-testid=notes-unavailable]"));
    }
}
