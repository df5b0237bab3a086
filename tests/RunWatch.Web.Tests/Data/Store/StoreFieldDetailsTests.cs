using Microsoft.Extensions.Options;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Web.Data.Fields;
using RunWatch.Web.Data.Store;
using Xunit;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>The full-field viewer's reads over the real SQLite store and a wire CSV as the report writes it (invented data).</summary>
public sealed class StoreFieldDetailsTests : IAsyncLifetime
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-web-fields-").FullName;
    private SqliteRunWatchStore _store = default!;

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
        await _store.MigrateAsync(CancellationToken.None);
        await _store.RegisterChambersAsync([new ChamberDefinition("c1", "invented lab", null, [])], CancellationToken.None);
        await _store.SaveRunAsync(new RunRecord { Chamber = "c1", Name = "R-1", Wafers = ["W-1"], StartedAt = T0 }, CancellationToken.None);
        await _store.UpsertWaferAsync("W-1", null, "nw-test", CancellationToken.None);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
        return Task.CompletedTask;
    }

    [Fact]
    public async Task GetFieldAsync_TwoFields_WiresWithPredictionsMatchedByFieldNameAndWafersParity()
    {
        long first = await AddAnalysedFieldAsync("f,1.png", "ab", [new FieldWire(1, 400, 800, 31.5, true, true, 0.4), new FieldWire(2, 900, 100, 20, true, false, null)]);
        long second = await AddAnalysedFieldAsync("f2.png", "cd", [new FieldWire(1, 300, 300, 28, true, true, 0.3)]);
        string csv = Path.Combine(_folder, "W-1-wires.csv");
        // As WireCsvWriter writes it: a field name with a comma is quoted; a wire not compared has empty cells.
        await File.WriteAllTextAsync(csv, "wafer_id,field,wire,x_nm,y_nm,radius_nm,normalised_area,predicted_radius_nm,vertical\r\n"
            + "W-1,\"f,1.png\",1,400,800,31.5,0.4,30.9,true\r\nW-1,\"f,1.png\",2,900,100,20,,,true\r\nW-1,f2.png,1,300,300,28,0.3,27.5,true\r\n");
        await _store.SaveReportAsync(new WaferReportRecord(0, "W-1", T0, "warn", "csv", csv, null), CancellationToken.None);
        var details = new StoreFieldDetails(_store, new StoreWaferData(_store));

        FieldDetail field = (await details.GetFieldAsync(first.ToString(System.Globalization.CultureInfo.InvariantCulture), CancellationToken.None))!;

        Assert.Equal((FieldQueueState.Done, "W-1", 4.0, 1000, 800), (field.State, field.WaferId, field.PixelSizeNm, field.WidthPx, field.HeightPx));
        Assert.Equal(30.9, field.Wires[0].PredictedRadiusNm);
        Assert.Null(field.Wires[1].PredictedRadiusNm);
        Assert.True(field.Wires[1].Guarded);
        Assert.Equal(2, field.WaferParity.Count);
        Assert.Contains(new ParityPoint(second.ToString(System.Globalization.CultureInfo.InvariantCulture), 1, 27.5, 28), field.WaferParity);
        Assert.Null(await details.GetFieldAsync("999", CancellationToken.None));
        Assert.Null(await details.GetFieldAsync("not-a-number", CancellationToken.None));
    }

    [Fact]
    public async Task GetFullImageAsync_PngServedAsIs_TiffWithoutRendererNotAvailable()
    {
        string png = Path.Combine(_folder, "f.png");
        await File.WriteAllBytesAsync(png, [0x89, 0x50, 0x4E, 0x47]);
        string tif = Path.Combine(_folder, "f.tif");
        await File.WriteAllBytesAsync(tif, [0x49, 0x49, 0x2A, 0x00]);
        var (a, _) = await _store.AddFieldAsync(new FieldRecord { Wafer = "W-1", FilePath = png, RelativePath = "f.png", Sha256 = "p", ImportedAt = T0 }, CancellationToken.None);
        var (b, _) = await _store.AddFieldAsync(new FieldRecord { Wafer = "W-1", FilePath = tif, RelativePath = "f.tif", Sha256 = "t", ImportedAt = T0 }, CancellationToken.None);
        var details = new StoreFieldDetails(_store, new StoreWaferData(_store));

        var plain = await details.GetFullImageAsync(a.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), analysisDrawn: false, CancellationToken.None);

        Assert.Equal(("image/png", 4), (plain!.ContentType, plain.Content.Length));
        Assert.Null(await details.GetFullImageAsync(b.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), analysisDrawn: false, CancellationToken.None));
    }

    private async Task<long> AddAnalysedFieldAsync(string name, string sha, IReadOnlyList<FieldWire> wires)
    {
        var (field, _) = await _store.AddFieldAsync(new FieldRecord
        {
            Wafer = "W-1", FilePath = "/drop/" + name, RelativePath = name, Sha256 = sha, ImportedAt = T0, NmPerPx = 4, WidthPx = 1000, HeightPx = 800, Status = FieldStatus.Analysed,
        }, CancellationToken.None);
        await _store.SaveAnalysisAsync(new AnalysisRecord
        {
            FieldId = field.Id, StartedAt = T0, Status = "done", WireCount = wires.Count,
            ResultsJson = FieldResultJson.Write(new FieldResult
            {
                FieldName = name, PixelSizeNm = 4, WidthNm = 4000, AnalysedHeightNm = 3000, Threshold = "t", AnalysedAreaCm2 = 1.2e-7, DiffusionLengthNm = 300, Wires = wires,
            }),
        }, CancellationToken.None);
        return field.Id;
    }
}
