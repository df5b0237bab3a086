using System.Diagnostics;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Simulation.Demo;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>
/// The drop-folder watcher on a real SQLite store meets a link to /dev/zero, a zero-byte image, a FIFO and an image
/// whose sidecar links to /dev/zero: each becomes a stored refusal a person can see, and the watcher keeps running.
/// </summary>
public sealed class IntakeRefusalTests : IAsyncLifetime
{
    private readonly string _root = Directory.CreateTempSubdirectory("rw-intake-refuse-").FullName;
    private SqliteRunWatchStore _store = null!;

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _root }), TimeProvider.System);
        await _store.MigrateAsync(default);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
        return Task.CompletedTask;
    }

    [Fact]
    public async Task Watcher_HostileFiles_StoredAsVisibleRefusalsAndWatcherKeepsRunning()
    {
        string drop = Path.Combine(_root, "drop");
        Directory.CreateDirectory(drop);
        File.CreateSymbolicLink(Path.Combine(drop, "W-Z1_f1.png"), "/dev/zero");
        await File.WriteAllBytesAsync(Path.Combine(drop, "W-Z1_f2.png"), []);
        using (var mkfifo = Process.Start("/usr/bin/mkfifo", [Path.Combine(drop, "W-Z1_f3.png")]))
        {
            await mkfifo.WaitForExitAsync();
        }
        string image = DemoWaferFields.Write(drop, "W-Z1", 300, 1e9, 1, seed: 3)[0];
        File.Delete(image + ".field.json"); // the generator writes a real sidecar; replace it with a link
        File.CreateSymbolicLink(image + ".field.json", "/dev/zero");

        var queue = new FieldAnalysisQueue(16);
        var intake = new FieldIntake(_store, _store, queue, WaferIdResolver.DefaultPattern, TimeProvider.System);
        using var watcher = new FieldIntakeService(intake,
            Options.Create(new IntakeOptions { DropFolder = "drop", StableFor = TimeSpan.FromMilliseconds(200), RescanInterval = TimeSpan.FromMilliseconds(200) }),
            Options.Create(new StorageOptions { DataDirectory = _root }), TimeProvider.System, NullLogger<FieldIntakeService>.Instance);
        await watcher.StartAsync(default);
        IReadOnlyList<FieldRecord> unassigned = [];
        var deadline = DateTime.UtcNow.AddSeconds(20);
        while (DateTime.UtcNow < deadline)
        {
            unassigned = await _store.GetFieldsByStatusAsync(FieldStatus.Unassigned, 100, default);
            if (unassigned.Count >= 4)
            {
                break;
            }
            await Task.Delay(100);
        }
        Assert.False(watcher.ExecuteTask!.IsCompleted, "the watcher stopped");
        await watcher.StopAsync(default);

        string Problem(string name) => unassigned.Single(f => f.RelativePath == name).Problem ?? "";
        Assert.StartsWith(FieldIntake.RefusedPrefix + "a symbolic link", Problem("W-Z1_f1.png"), StringComparison.Ordinal);
        Assert.StartsWith(FieldIntake.RefusedPrefix + "empty (zero bytes)", Problem("W-Z1_f2.png"), StringComparison.Ordinal);
        Assert.Contains("not a regular file", Problem("W-Z1_f3.png"), StringComparison.Ordinal);
        Assert.Contains("field.json: is a symbolic link", Problem(Path.GetFileName(image)), StringComparison.Ordinal);
        var refused = unassigned.Single(f => f.RelativePath == "W-Z1_f1.png");
        await Assert.ThrowsAsync<InvalidOperationException>(() => intake.AssignAsync(refused.Id, "W-Z1", "engineer1", default));
    }
}
