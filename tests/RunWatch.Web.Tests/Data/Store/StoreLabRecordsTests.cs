using Microsoft.Extensions.Options;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Web.Data.Store;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>Wafer list, wafer map and run trend points over the real SQLite store (invented data).</summary>
public sealed class StoreLabRecordsTests : IAsyncLifetime
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-web-lab-").FullName;
    private SqliteRunWatchStore _store = default!;
    private StoreLabRecords _records = default!;

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
        await _store.MigrateAsync(CancellationToken.None);
        await _store.RegisterChambersAsync([new ChamberDefinition("c1", "invented lab", null, [])], CancellationToken.None);
        RunRecord run = await _store.SaveRunAsync(new RunRecord { Chamber = "c1", Name = "R-1", Recipe = "nw-test", Wafers = ["W-1", "W-2"], StartedAt = T0, LEffNm = 310, TEffC = 611 }, CancellationToken.None);
        await _store.SaveRunAsync(new RunRecord { Chamber = "c1", Name = "R-0", Recipe = "nw-test", StartedAt = T0.AddDays(-1) }, CancellationToken.None);
        await _store.UpsertWaferAsync("W-1", run.Id, "nw-test", CancellationToken.None);
        await _store.UpsertWaferAsync("W-2", run.Id, "nw-test", CancellationToken.None);
        await AddFieldAsync("W-1", "a1", -20, 0, 27, 29, 28);
        await AddFieldAsync("W-1", "a2", 0, 0, 29, 31, 30);
        await AddFieldAsync("W-1", "a3", null, null, 30, 31);
        await AddReportAsync("W-1", "warn", 29.0, 1.2e9, 0.4);
        await AddReportAsync("W-2", "pass", 31.0, 0.8e9, -0.2);
        _records = new StoreLabRecords(_store);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
        return Task.CompletedTask;
    }

    private async Task AddFieldAsync(string wafer, string name, double? x, double? y, params double[] radii)
    {
        var (field, _) = await _store.AddFieldAsync(new FieldRecord
        {
            Wafer = wafer, FilePath = $"/drop/{name}.png", RelativePath = name + ".png", Sha256 = name, ImportedAt = T0, NmPerPx = 4, PositionXMm = x, PositionYMm = y,
        }, CancellationToken.None);
        await _store.SaveAnalysisAsync(new AnalysisRecord
        {
            FieldId = field.Id, StartedAt = T0, FinishedAt = T0, Status = "done", WireCount = radii.Length + 1,
            ResultsJson = FieldResultJson.Write(LabRecordsFactory.Field(name, radii)),
        }, CancellationToken.None);
    }

    private Task AddReportAsync(string wafer, string verdict, double meanNm, double densityPerCm2, double biasNm) =>
        _store.SaveReportAsync(new WaferReportRecord(0, wafer, T0, verdict, "json", Path.Combine(_folder, wafer + ".json"),
            WaferReportDigestJson.Write(LabRecordsFactory.Digest(meanNm, 0.1, densityPerCm2, biasNm))), CancellationToken.None);

    [Fact]
    public async Task ListWafersAsync_RowsWithRunProcessVerdictAndMean()
    {
        var rows = await _records.ListWafersAsync(CancellationToken.None);
        var w1 = rows.Single(r => r.WaferId == "W-1");
        Assert.Equal(("R-1", "c1", "nw-test", "WARN", T0, 29.0, 3), (w1.RunId, w1.Chamber, w1.Process, w1.Verdict, w1.Date, w1.MeanRadiusNm, w1.Fields));
        Assert.Equal(2, rows.Count);
    }

    [Fact]
    public async Task GetWaferMapAsync_StoredPositionsAndFieldFigures()
    {
        var map = (await _records.GetWaferMapAsync("W-1", CancellationToken.None))!;
        Assert.Equal(3, map.Fields.Count);
        Assert.Equal((-20.0, 0.0), (map.Fields[0].XMm!.Value, map.Fields[0].YMm!.Value));
        Assert.Equal(28, map.Fields[0].Figures!.MeanRadiusNm, 12);
        Assert.Null(map.Fields[2].XMm);
        Assert.Null(map.Fields[0].Verdict); // no specification catalogue registered: no field verdicts
        Assert.Equal(50.8, map.OutlineDiameterMm);
        // Two placed fields, means 28 and 30: U = 2 / (2 · 29) (DERIVED).
        Assert.Equal(2 / 58.0, map.Uniformity.NonUniformity, 12);
        Assert.Equal(-0.1, map.Uniformity.RadialSlopeNmPerMm!.Value, 12);
        Assert.Null(await _records.GetWaferMapAsync("W-NONE", CancellationToken.None));
    }

    [Fact]
    public async Task GetRunTrendPointsAsync_WaferFiguresAveragedPerRun_RunWithoutFiguresLeftOut()
    {
        var point = Assert.Single(await _records.GetRunTrendPointsAsync(CancellationToken.None));
        Assert.Equal("R-1", point.RunId);
        Assert.Equal("nw-test", point.Process);
        Assert.Equal("WARN", point.Verdict);
        Assert.Equal(30.0, point.MeanRadiusNm, 12);
        Assert.Equal(10.0, point.DensityPerUm2, 9); // (12 + 8) / 2 µm⁻²
        Assert.Equal(0.1, point.BiasNm, 12);
        Assert.Equal(310, point.LEffNm);
    }
}
