using System.Diagnostics;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Excursions;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using RunWatch.Simulation.Demo;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Testing.Documents;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>
/// The wafer pipeline on a real SQLite store and real image files: a closed run names two wafers, generated SEM
/// fields (invented demo data) arrive, are taken in, analysed with the run's L_eff, and each wafer gets its report
/// files with a verdict. The PDF is read back with pdftotext (poppler-utils, an independent reader).
/// </summary>
public sealed class WaferPipelineTests : IAsyncLifetime
{
    private static readonly DateTimeOffset RunStart = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _root = Directory.CreateTempSubdirectory("rw-pipeline-").FullName;
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
        var chambers = await _store.RegisterChambersAsync([new ChamberDefinition("C1", "lab", "invented test chamber",
        [
            new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1200, []),
            new ChannelDefinition("substrate_sp", ChannelRole.Setpoint, "degC", null, null, []),
        ])], default);
        var batch = new IngestBatch();
        long chamberId = chambers[0].ChamberId;
        long channelId = chambers[0].Channels[0].ChannelId;
        for (int s = 0; s <= 600; s++)
        {
            double t = 600 + (s is > 200 and < 230 ? 12 : 0);
            batch.AddSample(new SampleRow(chamberId, channelId, UnixMicros.From(RunStart.AddSeconds(s)), s, t));
        }
        await _store.WriteBatchAsync(batch, default);
        await _store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R-TEST-1", Recipe = "invented-recipe", Wafers = ["W-T1-A", "W-T1-B"], SetpointC = 600, PlannedSeconds = 600,
            StartedAt = RunStart, EndedAt = RunStart.AddSeconds(600), Status = RunStatus.Closed, LNomNm = 290, LEffNm = 300, TEffC = 600.4, Coverage = 1,
            Excursions = [new RunExcursionRecord(RunStart.AddSeconds(201), RunStart.AddSeconds(229), 28, 12, 612, ExcursionSeverity.Warning, 3.1, Closed: true)],
            Summary = new RunThermalSummary(ConventionFactor: 1, IntegralCmSq: 0, CoveredS: 0, WindowStartS: 60, WindowEndS: 560, GapCount: 0, IsComplete: true,
                LogSensitivityPerK: null, SampleCount: 0, HasPlan: false, Error: null),
        }, default);

        var pipeline = Options.Create(new WaferPipelineOptions { PredictionFields = 2 });
        var qc = Options.Create(new QcOptions
        {
            Recipes = { ["invented-recipe"] = new QcSpecification { MinWireCount = 50, MaxRadiusCv = 0.5, MinThermalCoverage = 0.9, MaxExcursionCount = 3 } },
        });
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

    private async Task<FieldRecord> DropAsync(string path)
    {
        var info = new FileInfo(path);
        var (field, _) = await _intake.TakeInAsync(new ArrivedField(path, Path.GetFileName(path), info.Length, info.LastWriteTimeUtc), default);
        return field;
    }

    [Fact]
    public async Task TwoWafersInOneRun_FieldsAnalysedAndReportsWritten()
    {
        string drop = Path.Combine(_root, "drop");
        var paths = DemoWaferFields.Write(drop, "W-T1-A", 300, 1e9, 2, seed: 5).Concat(DemoWaferFields.Write(drop, "W-T1-B", 300, 1e9, 1, seed: 6)).ToList();

        foreach (string p in paths)
        {
            Assert.Equal(FieldStatus.Queued, (await DropAsync(p)).Status);
        }
        Assert.Equal(3, _queue.Waiting);
        while (_queue.Reader.TryRead(out long id))
        {
            var (ok, _) = await _analysis.AnalyseAsync(id, default);
            Assert.True(ok);
        }

        foreach (string wafer in new[] { "W-T1-A", "W-T1-B" })
        {
            WaferReportOutcome outcome = await _reports.WriteAsync(wafer, default);
            foreach (string format in new[] { "html", "pdf", "csv", "json" })
            {
                Assert.True(File.Exists(outcome.Files[format]), format);
            }
            string pdfText = PopplerText.Text(outcome.Files["pdf"]);
            Assert.Contains(wafer, pdfText, StringComparison.Ordinal);
            Assert.Contains(outcome.Verdict.Outcome.ToString().ToUpperInvariant(), pdfText.ToUpperInvariant(), StringComparison.Ordinal);
            Assert.Equal(4, (await _store.GetReportsAsync(wafer, default)).Count);
            Assert.True(File.ReadAllLines(outcome.Files["csv"]).Length > 50, "every wire in the CSV");
        }
        // The run's recipe has no accepted diffusion model (the default radius model): each verdict says so and what to do,
        // and a report never proposes or accepts a model by itself (a refit on the Process model screen proposes one).
        foreach (string wafer in new[] { "W-T1-A", "W-T1-B" })
        {
            WaferReportOutcome again = await _reports.WriteAsync(wafer, default);
            QcRuleResult rule = Assert.Single(again.Verdict.Rules, r => r.Rule == WaferEvaluator.RadiusModelRule);
            Assert.Equal(QcOutcome.Warn, rule.Outcome);
            Assert.Contains("No accepted diffusion radius model for process 'invented-recipe'", rule.Reason, StringComparison.Ordinal);
            Assert.Contains("Refit", rule.Reason, StringComparison.Ordinal);
        }
        Assert.Empty(await _store.GetModelFitsAsync("invented-recipe", ModelKinds.Radius, 10, default));
        Assert.Empty(await _store.GetModelFitsAsync("invented-recipe", ModelKinds.Diffusion, 10, default));
    }

    [Fact]
    public async Task ReanalyseOnRequest_QueuesAnalysedFieldsAgainAndRecordsWho()
    {
        string drop = Path.Combine(_root, "drop4");
        string path = DemoWaferFields.Write(drop, "W-T1-A", 300, 1e9, 1, seed: 8)[0];
        FieldRecord field = await DropAsync(path);
        Assert.True(_queue.Reader.TryRead(out long id));
        Assert.True((await _analysis.AnalyseAsync(id, default)).Ok);
        Assert.Equal(0, _queue.Waiting);

        int queued = await _intake.ReanalyseWaferAsync("W-T1-A", "engineer1", default);

        Assert.Equal(1, queued);
        Assert.Equal(1, _queue.Waiting);
        Assert.Equal(FieldStatus.Queued, (await _store.GetFieldAsync(field.Id, default))!.Status);
        Assert.Equal(1, CountAudit("reanalyse-wafer", "engineer1"));
    }

    private long CountAudit(string action, string actor)
    {
        using var connection = new SqliteConnection("Data Source=" + Path.Combine(_root, "runwatch.db") + ";Pooling=False");
        connection.Open();
        using var command = connection.CreateCommand();
        command.CommandText = "SELECT COUNT(*) FROM audit_entries WHERE action = $a AND actor = $u";
        command.Parameters.AddWithValue("$a", action);
        command.Parameters.AddWithValue("$u", actor);
        return (long)command.ExecuteScalar()!;
    }

    [Fact]
    public async Task ImageForUnknownWafer_WaitsUnassignedThenAssignedByAPerson()
    {
        string drop = Path.Combine(_root, "drop2");
        string path = DemoWaferFields.Write(drop, "W-NOBODY-9", 300, 1e9, 1, seed: 7)[0];

        FieldRecord field = await DropAsync(path);
        Assert.Equal(FieldStatus.Unassigned, field.Status);
        Assert.Contains("no run has named wafer W-NOBODY-9", field.Problem, StringComparison.Ordinal);
        await Assert.ThrowsAsync<InvalidOperationException>(() => _intake.AssignAsync(field.Id, "W-NOBODY-9", "engineer1", default));

        FieldRecord assigned = await _intake.AssignAsync(field.Id, "W-T1-B", "engineer1", default);

        Assert.Equal(FieldStatus.Queued, assigned.Status);
        Assert.Equal("W-T1-B", assigned.Wafer);
    }

    [Fact]
    public async Task CorruptImage_FieldFailsWithReasonAndOthersGoOn()
    {
        string drop = Path.Combine(_root, "drop3");
        Directory.CreateDirectory(drop);
        string bad = Path.Combine(drop, "W-T1-A_broken.png");
        await File.WriteAllBytesAsync(bad, [0x89, 0x50, 0x4E, 0x47, 1, 2, 3]);
        FieldRecord field = await DropAsync(bad);

        var (ok, wafer) = await _analysis.AnalyseAsync(field.Id, default);

        Assert.False(ok);
        Assert.Equal("W-T1-A", wafer);
        FieldRecord failed = (await _store.GetFieldAsync(field.Id, default))!;
        Assert.Equal(FieldStatus.Failed, failed.Status);
        Assert.Contains("W-T1-A_broken.png", failed.Problem, StringComparison.Ordinal);
    }
}
