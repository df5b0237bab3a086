using System.Text;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Backup;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Records;
using Xunit;

namespace RunWatch.Tests.Backup;

/// <summary>
/// Report revisions survive a backup and a restore: the revision rows come back from the database and the issued
/// (read-only) files byte for byte, so the restored revision still verifies against the restored store.
/// </summary>
public sealed class RevisionBackupTests : IDisposable
{
    private readonly string _root = Directory.CreateTempSubdirectory("rw-revision-backup-").FullName;

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
    }

    [Fact]
    public async Task BackupAndRestore_IssuedRevision_RowsAndFilesComeBackAndStillVerify()
    {
        string live = Path.Combine(_root, "live");
        string restored = Path.Combine(_root, "restored");
        string folder = Path.Combine(live, "reports", "W-INV-3", "r1");
        Directory.CreateDirectory(folder);
        var files = new List<ReportManifestFile>();
        foreach ((string name, string text) in new[] { ("W-INV-3-r1.html", "<html>invented</html>"), ("W-INV-3-r1.pdf", "%PDF invented"), ("W-INV-3-r1-wires.csv", "field,wire\n"), ("W-INV-3-r1.json", "{}") })
        {
            byte[] bytes = Encoding.UTF8.GetBytes(text);
            await File.WriteAllBytesAsync(Path.Combine(folder, name), bytes);
            files.Add(new ReportManifestFile(name, ReportHashes.Of(bytes), bytes.Length));
        }
        string content = ReportHashes.ContentHash(files);
        var manifest = new ReportRevisionManifest
        {
            Wafer = "W-INV-3", Revision = 1, CreatedAt = new DateTimeOffset(2026, 3, 4, 12, 0, 0, TimeSpan.Zero), Reason = "first issue", Requester = "intake",
            SoftwareVersion = "1.0", ConfigSha256 = "c0ffee", ModelId = "none accepted", Inputs = [], Files = files, ContentSha256 = content,
        };
        await File.WriteAllBytesAsync(Path.Combine(folder, ReportHashes.ListingFileName), ReportHashes.Listing(files));
        await File.WriteAllTextAsync(Path.Combine(folder, ReportHashes.ManifestFileName), ReportHashes.WriteManifest(manifest));
        foreach (string f in Directory.EnumerateFiles(folder))
        {
            if (!OperatingSystem.IsWindows())
            {
                File.SetUnixFileMode(f, UnixFileMode.UserRead | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
            }
        }
        using (var store = Open(live))
        {
            await store.MigrateAsync(default);
            Assert.NotNull(await store.AddReportRevisionAsync(new ReportRevisionRecord
            {
                Wafer = "W-INV-3", Revision = 1, CreatedAt = manifest.CreatedAt, Reason = "first issue", Requester = "intake", SoftwareVersion = "1.0",
                ConfigSha256 = "c0ffee", ConfigJson = "{}", ModelId = "none accepted", Inputs = [], ContentSha256 = content, Folder = folder,
                Verdict = "pass", DigestJson = "{}",
            }, [], default));
        }
        SqliteConnection.ClearAllPools();

        string archive = Path.Combine(_root, "backup.tar");
        DataArchive.Create(live, "runwatch.db", archive, DateTimeOffset.UtcNow);
        DataArchive.Restore(archive, restored);

        using var back = Open(restored);
        IReadOnlyList<ReportRevisionRecord> revisions = await back.GetReportRevisionsAsync("W-INV-3", default);
        ReportRevisionRecord revision = Assert.Single(revisions);
        Assert.Equal(content, revision.ContentSha256);
        string restoredFolder = Path.Combine(restored, "reports", "W-INV-3", "r1");
        foreach (string f in Directory.EnumerateFiles(folder))
        {
            Assert.Equal(await File.ReadAllBytesAsync(f), await File.ReadAllBytesAsync(Path.Combine(restoredFolder, Path.GetFileName(f))));
        }
        ReportVerification check = await ReportRevisionVerifier.VerifyAsync(restoredFolder, back, default);
        Assert.True(check.Verified, string.Join("; ", check.Problems));
    }

    private static SqliteRunWatchStore Open(string folder) =>
        new(Options.Create(new StorageOptions { DataDirectory = folder, DatabaseFile = "runwatch.db" }), TimeProvider.System);
}
