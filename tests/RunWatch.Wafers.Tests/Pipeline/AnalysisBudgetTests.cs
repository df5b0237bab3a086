using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Intake;
using RunWatch.Wafers.Pipeline;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>
/// The per-field time budget on a real store: a pathological field (about 120 000 wires on 24 megapixels, many
/// seconds of work) queued before a small one fails with a budget message, and the small field behind it is
/// analysed: the queue moves on because the analysis itself stops (its loops watch the budget's token).
/// </summary>
public sealed class AnalysisBudgetTests : IAsyncLifetime
{
    private static readonly DateTimeOffset RunStart = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _root = Directory.CreateTempSubdirectory("rw-budget-").FullName;
    private SqliteRunWatchStore _store = null!;

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _root }), TimeProvider.System);
        await _store.MigrateAsync(default);
        await _store.RegisterChambersAsync([new ChamberDefinition("C1", "lab", "invented test chamber",
            [new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1200, [])])], default);
        await _store.SaveRunAsync(new RunRecord
        {
            Chamber = "C1", Name = "R-BUDGET", Recipe = "invented-recipe", Wafers = ["W-B1"], SetpointC = 600, PlannedSeconds = 600,
            StartedAt = RunStart, EndedAt = RunStart.AddSeconds(600), Status = RunStatus.Closed, LNomNm = 290, LEffNm = 300, TEffC = 600, Coverage = 1,
        }, default);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
        return Task.CompletedTask;
    }

    [Fact]
    public async Task AnalyseAsync_PathologicalFieldOverBudget_FailsWithBudgetAndTheNextFieldIsAnalysed()
    {
        var pipeline = Options.Create(new WaferPipelineOptions { FieldAnalysisBudget = TimeSpan.FromSeconds(1.5), DefaultPixelSizeNm = 2 });
        var storage = Options.Create(new StorageOptions { DataDirectory = _root });
        var queue = new FieldAnalysisQueue(8);
        var intake = new FieldIntake(_store, _store, queue, WaferIdResolver.DefaultPattern, TimeProvider.System);
        var reports = new WaferReportService(_store, _store, pipeline, Options.Create(new QcOptions()), storage, TimeProvider.System);
        var analysis = new FieldAnalysisService(queue, _store, reports, pipeline, TimeProvider.System, NullLogger<FieldAnalysisService>.Instance);
        string drop = Path.Combine(_root, "drop");
        Directory.CreateDirectory(drop);
        string crowded = Path.Combine(drop, "W-B1_crowded.png");
        WriteCrowded(crowded, 6000, 4000);
        string ordinary = Path.Combine(drop, "W-B1_small.png");
        WriteCrowded(ordinary, 400, 300);
        foreach (string path in new[] { crowded, ordinary })
        {
            var info = new FileInfo(path);
            await intake.TakeInAsync(new ArrivedField(path, Path.GetFileName(path), info.Length, info.LastWriteTimeUtc), default);
        }

        Assert.True(queue.Reader.TryRead(out long first));
        var (firstOk, _) = await analysis.AnalyseAsync(first, default);
        Assert.True(queue.Reader.TryRead(out long second));
        var (secondOk, _) = await analysis.AnalyseAsync(second, default);

        FieldRecord failed = (await _store.GetFieldAsync(first, default))!;
        Assert.False(firstOk);
        Assert.Equal(FieldStatus.Failed, failed.Status);
        Assert.Contains("budget", failed.Problem, StringComparison.Ordinal);
        Assert.Equal("failed", (await _store.GetLatestAnalysisAsync(first, default))!.Status);
        Assert.True(secondOk, (await _store.GetFieldAsync(second, default))!.Problem);
        Assert.Equal(FieldStatus.Analysed, (await _store.GetFieldAsync(second, default))!.Status);
    }

    /// <summary>Bright discs of radius 3.5 px on a jittered 14 px grid (seeded) over a noisy dark background, 16-bit PNG.</summary>
    private static void WriteCrowded(string path, int width, int height)
    {
        var random = new Random(23);
        using var image = new Image<L16>(width, height);
        image.ProcessPixelRows(rows =>
        {
            for (int y = 0; y < height; y++)
            {
                Span<L16> row = rows.GetRowSpan(y);
                for (int x = 0; x < width; x++)
                {
                    row[x] = new L16((ushort)(8000 + random.Next(0, 1500)));
                }
            }
        });
        for (int cy = 10; cy < height - 10; cy += 14)
        {
            for (int cx = 10; cx < width - 10; cx += 14)
            {
                double x0 = cx + random.NextDouble() * 3, y0 = cy + random.NextDouble() * 3;
                for (int y = (int)y0 - 4; y <= (int)y0 + 4; y++)
                {
                    for (int x = (int)x0 - 4; x <= (int)x0 + 4; x++)
                    {
                        if ((x - x0) * (x - x0) + (y - y0) * (y - y0) <= 3.5 * 3.5)
                        {
                            image[x, y] = new L16(50000);
                        }
                    }
                }
            }
        }
        image.SaveAsPng(path);
    }
}
