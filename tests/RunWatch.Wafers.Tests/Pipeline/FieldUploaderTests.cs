using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Imaging.Scale;
using RunWatch.Simulation.Demo;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>
/// The upload path shared by the API and the dashboard's form, on a real SQLite store and real files: a whole image
/// with its sidecar lands under its name and is queued; a refusal (not an image, too large, a name used before)
/// leaves no file, no partial file and no field behind.
/// </summary>
public sealed class FieldUploaderTests : IAsyncLifetime
{
    private readonly string _root = Directory.CreateTempSubdirectory("rw-upload-").FullName;
    private SqliteRunWatchStore _store = null!;
    private FieldUploader _uploader = null!;
    private FieldIntakeService _watcher = null!;
    private string _image = "";

    public async Task InitializeAsync()
    {
        var storage = Options.Create(new StorageOptions { DataDirectory = _root });
        _store = new SqliteRunWatchStore(storage, TimeProvider.System);
        await _store.MigrateAsync(default);
        await _store.RegisterChambersAsync([new ChamberDefinition("C1", "lab", "invented test chamber",
            [new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1200, [])])], default);
        await _store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R-UP-1", Recipe = "invented-recipe", Wafers = ["W-UP-A"], SetpointC = 600, PlannedSeconds = 600,
            StartedAt = new DateTimeOffset(2026, 3, 4, 10, 0, 0, TimeSpan.Zero), Status = RunStatus.Closed,
        }, default);
        var intakeOptions = Options.Create(new IntakeOptions { MaxUploadBytes = 8 * 1024 * 1024 });
        var intake = new FieldIntake(_store, _store, new FieldAnalysisQueue(16), WaferIdResolver.DefaultPattern, TimeProvider.System);
        _watcher = new FieldIntakeService(intake, intakeOptions, storage, TimeProvider.System, NullLogger<FieldIntakeService>.Instance);
        _uploader = new FieldUploader(intake, _watcher, intakeOptions);
        _image = DemoWaferFields.Write(Path.Combine(_root, "made"), "W-UP-A", 300, 1e9, 1, 77)[0];
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
        return Task.CompletedTask;
    }

    private string Uploads => Path.Combine(_watcher.DropFolder, "uploads");

    [Fact]
    public async Task UploadAsync_ImageWithSidecar_StoredUnderItsNameAndQueued()
    {
        byte[] bytes = await File.ReadAllBytesAsync(_image);
        var sidecar = new FieldSidecar { WaferId = "W-UP-A", PixelSizeNm = 4 };

        var outcome = await UploadAsync("plain-name.png", bytes, sidecar);
        var again = await UploadAsync("other-name.png", bytes, null);

        Assert.Equal(201, outcome.StatusCode);
        Assert.Equal((FieldStatus.Queued, "W-UP-A", 4.0), (outcome.Field!.Status, outcome.Field.Wafer, outcome.Field.NmPerPx));
        Assert.Equal(bytes, await File.ReadAllBytesAsync(Path.Combine(Uploads, "plain-name.png")));
        Assert.Equal("W-UP-A", FieldSidecar.TryLoadFor(Path.Combine(Uploads, "plain-name.png"))!.WaferId);
        Assert.Equal((200, false, outcome.Field.Id), (again.StatusCode, again.Added, again.Field!.Id)); // the same bytes are one field
        Assert.Empty(Directory.GetFiles(Uploads, ".*"));
    }

    [Fact]
    public async Task UploadAsync_NotAnImageTooLargeOrNameTaken_RefusedAndNothingLeft()
    {
        byte[] bytes = await File.ReadAllBytesAsync(_image);
        var first = await UploadAsync("W-UP-A_f1.png", bytes, null);
        var text = await UploadAsync("W-UP-A_f2.png", "not an image at all"u8.ToArray(), new FieldSidecar { PixelSizeNm = 4 });
        var large = await UploadAsync("W-UP-A_f3.png", new byte[(8 * 1024 * 1024) + 1], null);
        var taken = await UploadAsync("W-UP-A_f1.png", [.. bytes, 0], new FieldSidecar { PixelSizeNm = 5 });
        var folders = await UploadAsync("../W-UP-A_f4.png", bytes, null);

        Assert.Equal(201, first.StatusCode);
        Assert.Equal(400, text.StatusCode);
        Assert.StartsWith("not an image the analysis can read", text.Problem, StringComparison.Ordinal);
        Assert.Equal(413, large.StatusCode);
        Assert.Equal(409, taken.StatusCode);
        Assert.Equal(400, folders.StatusCode);
        Assert.Equal(["W-UP-A_f1.png"], Directory.GetFiles(Uploads).Select(Path.GetFileName)); // no partial, no stray sidecar
        Assert.Equal(bytes, await File.ReadAllBytesAsync(Path.Combine(Uploads, "W-UP-A_f1.png")));
        Assert.Single(await _store.GetFieldsOfWaferAsync("W-UP-A", default));
        Assert.Empty(await _store.GetFieldsByStatusAsync(FieldStatus.Unassigned, 10, default));
    }

    private async Task<FieldUploadOutcome> UploadAsync(string name, byte[] bytes, FieldSidecar? sidecar)
    {
        using var body = new MemoryStream(bytes);
        return await _uploader.UploadAsync(name, body, sidecar, checkImage: true, default);
    }
}
