using System.Diagnostics;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Simulation.Demo;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using RunWatch.Wafers.Records;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>
/// Reports as records on a real SQLite store with real (invented, generated) SEM fields: each issue is a numbered
/// revision that is never overwritten, with its reason, requester and hashes; hashes are checked against GNU
/// coreutils' /usr/bin/sha256sum (an implementation independent of .NET's).
/// </summary>
public sealed class ReportRevisionTests : IAsyncLifetime
{
    private static readonly DateTimeOffset RunStart = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _root = Directory.CreateTempSubdirectory("rw-revisions-").FullName;
    private SqliteRunWatchStore _store = null!;
    private FieldIntake _intake = null!;
    private FieldAnalysisQueue _queue = null!;
    private FieldAnalysisService _analysis = null!;
    private WaferReportService _reports = null!;

    public async Task InitializeAsync()
    {
        var storage = Options.Create(new StorageOptions { DataDirectory = _root });
        _store = new SqliteRunWatchStore(storage, TimeProvider.System);
        await _store.MigrateAsync(default);
        await _store.RegisterChambersAsync([new ChamberDefinition("C1", "lab", "invented test chamber",
            [new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1200, [])])], default);
        await _store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R-REV-1", Recipe = "invented-recipe", Wafers = ["W-R1-A"], SetpointC = 600, PlannedSeconds = 600,
            StartedAt = RunStart, EndedAt = RunStart.AddSeconds(600), Status = RunStatus.Closed, LNomNm = 290, LEffNm = 300, TEffC = 600.4, Coverage = 1,
        }, default);
        var pipeline = Options.Create(new WaferPipelineOptions { PredictionFields = 1 });
        var qc = Options.Create(new QcOptions { Recipes = { ["invented-recipe"] = new QcSpecification { MinWireCount = 20 } } });
        _queue = new FieldAnalysisQueue(16);
        _intake = new FieldIntake(_store, _store, _queue, WaferIdResolver.DefaultPattern, TimeProvider.System);
        _reports = new WaferReportService(_store, _store, pipeline, qc, storage, TimeProvider.System);
        _analysis = new FieldAnalysisService(_queue, _store, _reports, pipeline, TimeProvider.System, NullLogger<FieldAnalysisService>.Instance);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
        return Task.CompletedTask;
    }

    [Fact]
    public async Task Reanalyse_IssuedWafer_WritesRevision2WithReasonAndRequesterAndKeepsRevision1ByteIdentical()
    {
        await DropAndAnalyseAsync(seed: 3, fields: 1);
        WaferReportOutcome first = await _reports.WriteAsync("W-R1-A", default);
        Dictionary<string, byte[]> before = Snapshot(first.Folder);

        int queued = await _intake.ReanalyseWaferAsync("W-R1-A", "eve-engineer", "threshold setting changed", default);
        await AnalyseQueuedAsync();
        WaferReportOutcome second = await _reports.WriteAsync("W-R1-A", default);

        Assert.Equal(1, queued);
        Assert.Equal((1, "first issue", "intake"), (first.Revision!.Revision, first.Revision.Reason, first.Revision.Requester));
        Assert.Equal(2, second.Revision!.Revision);
        Assert.Equal("re-analysis requested: threshold setting changed", second.Revision.Reason);
        Assert.Equal("eve-engineer", second.Revision.Requester);
        Assert.NotEqual(first.Folder, second.Folder);
        // Revision 1 is untouched, byte for byte, and nothing was added to its folder.
        Assert.Equal(before.Keys.Order(), Snapshot(first.Folder).Keys.Order());
        foreach (var (name, bytes) in Snapshot(first.Folder))
        {
            Assert.True(bytes.AsSpan().SequenceEqual(before[name]), name + " of revision 1 changed");
        }
        var revisions = await _store.GetReportRevisionsAsync("W-R1-A", default);
        Assert.Equal([1, 2], revisions.Select(r => r.Revision));
        Assert.Empty(await _store.GetPendingReportRequestsAsync("W-R1-A", default));
        // The newest files are what the dashboard offers.
        Assert.All(await _store.GetReportsAsync("W-R1-A", default), r => Assert.StartsWith(second.Folder, r.FilePath, StringComparison.Ordinal));
        // The reason and the requester are printed in the report itself (read back by poppler's pdftotext).
        string pdf = RunWatch.Testing.Documents.PopplerText.Text(second.Files["pdf"]);
        Assert.Contains("eve-engineer", pdf, StringComparison.Ordinal);
        Assert.Contains("threshold setting changed", pdf, StringComparison.Ordinal);
    }

    [Fact]
    public async Task NewField_IssuedWafer_NextRevisionSaysIntakeAndNamesTheField()
    {
        await DropAndAnalyseAsync(seed: 4, fields: 1);
        await _reports.WriteAsync("W-R1-A", default);

        string extra = DemoWaferFields.Write(Path.Combine(_root, "drop-late"), "W-R1-A", 300, 1e9, 1, seed: 9)[0];
        await TakeInAsync(extra);
        await AnalyseQueuedAsync();
        WaferReportOutcome second = await _reports.WriteAsync("W-R1-A", default);

        Assert.Equal(2, second.Revision!.Revision);
        Assert.Equal("intake", second.Revision.Requester);
        Assert.Equal("new field " + Path.GetFileName(extra), second.Revision.Reason);
        Assert.Equal(2, second.Revision.Inputs.Count);
    }

    [Fact]
    public async Task Revision_Hashes_MatchCoreutilsSha256sum()
    {
        IReadOnlyList<string> images = await DropAndAnalyseAsync(seed: 5, fields: 2);
        WaferReportOutcome outcome = await _reports.WriteAsync("W-R1-A", default);
        ReportRevisionManifest manifest = ReportHashes.ReadManifest(File.ReadAllText(Path.Combine(outcome.Folder, ReportHashes.ManifestFileName)));

        // Reference: GNU coreutils sha256sum (FIPS 180-4), run on the files as they lie on disk.
        foreach (ReportManifestFile f in manifest.Files)
        {
            Assert.Equal(Sha256sum(outcome.Folder, f.Name), f.Sha256);
        }
        Assert.Equal(4, manifest.Files.Count);
        Assert.Equal(Sha256sum(outcome.Folder, ReportHashes.ListingFileName), outcome.Revision!.ContentSha256);
        Assert.Equal(manifest.ContentSha256, outcome.Revision.ContentSha256);
        Assert.Equal("", Run("/usr/bin/sha256sum", outcome.Folder, "--check", "--quiet", ReportHashes.ListingFileName).Trim());
        foreach (string image in images)
        {
            ReportInputHash input = Assert.Single(outcome.Revision.Inputs, i => i.Path == image);
            Assert.Equal(Sha256sum(Path.GetDirectoryName(image)!, Path.GetFileName(image)), input.Sha256);
        }
        Assert.Equal(ReportHashes.Of(System.Text.Encoding.UTF8.GetBytes(outcome.Revision.ConfigJson)), outcome.Revision.ConfigSha256);
        Assert.True((await ReportRevisionVerifier.VerifyAsync(outcome.Folder, _store, default)).Verified);
    }

    [Theory]
    [InlineData("pdf", 1000)]
    [InlineData("html", 10)]
    [InlineData("json", 3)]
    public async Task Verify_OneByteChangedInAReportFile_ReportsTheMismatch(string format, int offset)
    {
        await DropAndAnalyseAsync(seed: 6, fields: 1);
        WaferReportOutcome outcome = await _reports.WriteAsync("W-R1-A", default);
        string path = outcome.Files[format];
        Assert.True((await ReportRevisionVerifier.VerifyAsync(path, _store, default)).Verified);

        MakeWritable(path); // issued files are read-only
        byte[] bytes = File.ReadAllBytes(path);
        bytes[offset] ^= 0x01;
        File.WriteAllBytes(path, bytes);
        ReportVerification result = await ReportRevisionVerifier.VerifyAsync(path, _store, default);

        Assert.False(result.Verified);
        Assert.Contains(result.Problems, p => p.Contains(Path.GetFileName(path), StringComparison.Ordinal) && p.Contains("changed", StringComparison.Ordinal));
        Assert.Contains(result.Problems, p => p.StartsWith("content hash", StringComparison.Ordinal));
        Assert.Contains(result.Problems, p => p.StartsWith("the store records", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Verify_InputImageChangedOrGone_MismatchOrNote()
    {
        IReadOnlyList<string> images = await DropAndAnalyseAsync(seed: 7, fields: 2);
        WaferReportOutcome outcome = await _reports.WriteAsync("W-R1-A", default);

        byte[] bytes = File.ReadAllBytes(images[0]);
        bytes[^1] ^= 0x01;
        File.WriteAllBytes(images[0], bytes);
        File.Delete(images[1]);
        ReportVerification result = await ReportRevisionVerifier.VerifyAsync(outcome.Folder, _store, default);

        Assert.False(result.Verified);
        Assert.Contains(result.Problems, p => p.Contains("input image " + Path.GetFileName(images[0]), StringComparison.Ordinal));
        Assert.Contains(result.Notes, n => n.Contains(Path.GetFileName(images[1]), StringComparison.Ordinal) && n.Contains("not checked", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Verify_ManifestAndListingRewrittenToMatchAChangedFile_StoreStillCatchesIt()
    {
        await DropAndAnalyseAsync(seed: 8, fields: 1);
        WaferReportOutcome outcome = await _reports.WriteAsync("W-R1-A", default);
        string csv = outcome.Files["csv"];
        MakeWritable(csv);
        File.AppendAllText(csv, "x\n");
        string manifestPath = Path.Combine(outcome.Folder, ReportHashes.ManifestFileName);
        string listingPath = Path.Combine(outcome.Folder, ReportHashes.ListingFileName);
        var manifest = ReportHashes.ReadManifest(File.ReadAllText(manifestPath));
        var files = manifest.Files.Select(f => f.Name == Path.GetFileName(csv) ? f with { Sha256 = ReportHashes.OfFile(csv) } : f).ToList();
        MakeWritable(manifestPath);
        MakeWritable(listingPath);
        File.WriteAllText(manifestPath, ReportHashes.WriteManifest(manifest with { Files = files, ContentSha256 = ReportHashes.ContentHash(files) }));
        File.WriteAllBytes(listingPath, ReportHashes.Listing(files));

        Assert.True((await ReportRevisionVerifier.VerifyAsync(csv, null, default)).Verified); // a consistent forgery passes the manifest alone
        ReportVerification withStore = await ReportRevisionVerifier.VerifyAsync(csv, _store, default);
        Assert.False(withStore.Verified);
        Assert.Contains(withStore.Problems, p => p.StartsWith("the store records", StringComparison.Ordinal));
    }

    private async Task<IReadOnlyList<string>> DropAndAnalyseAsync(int seed, int fields)
    {
        IReadOnlyList<string> paths = DemoWaferFields.Write(Path.Combine(_root, "drop-" + seed), "W-R1-A", 300, 1e9, fields, seed);
        foreach (string p in paths)
        {
            await TakeInAsync(p);
        }
        await AnalyseQueuedAsync();
        return paths;
    }

    private async Task TakeInAsync(string path)
    {
        var info = new FileInfo(path);
        var (field, _) = await _intake.TakeInAsync(new ArrivedField(path, Path.GetFileName(path), info.Length, info.LastWriteTimeUtc), default);
        Assert.Equal(FieldStatus.Queued, field.Status);
    }

    private async Task AnalyseQueuedAsync()
    {
        while (_queue.Reader.TryRead(out long id))
        {
            Assert.True((await _analysis.AnalyseAsync(id, default)).Ok);
        }
    }

    private static Dictionary<string, byte[]> Snapshot(string folder) =>
        Directory.EnumerateFiles(folder).ToDictionary(f => Path.GetFileName(f) ?? f, File.ReadAllBytes);

    /// <summary>Issued files are read-only; a test that tampers with one must make it writable first, as a person would.</summary>
    private static void MakeWritable(string path)
    {
        if (!OperatingSystem.IsWindows())
        {
            File.SetUnixFileMode(path, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        }
    }

    private static string Sha256sum(string folder, string file) => Run("/usr/bin/sha256sum", folder, "--", file).Split(' ')[0];

    private static string Run(string program, string folder, params string[] args)
    {
        var start = new ProcessStartInfo(program) { WorkingDirectory = folder, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (string a in args)
        {
            start.ArgumentList.Add(a);
        }
        using var process = Process.Start(start)!;
        string output = process.StandardOutput.ReadToEnd();
        string error = process.StandardError.ReadToEnd();
        process.WaitForExit();
        Assert.True(process.ExitCode == 0, program + " failed: " + error + output);
        return output;
    }
}
