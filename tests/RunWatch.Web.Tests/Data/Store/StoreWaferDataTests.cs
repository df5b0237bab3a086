using Microsoft.Extensions.Options;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Web.Data;
using RunWatch.Web.Data.Store;
using Xunit;

namespace RunWatch.Web.Tests.Data.Store;

/// <summary>Wafer screens over the real SQLite store and report files as the pipeline writes them (invented data).</summary>
public sealed class StoreWaferDataTests : IAsyncLifetime
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-web-wafers-").FullName;
    private SqliteRunWatchStore _store = default!;
    private StoreWaferData _data = default!;

    public async Task InitializeAsync()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
        await _store.MigrateAsync(CancellationToken.None);
        await _store.RegisterChambersAsync([new ChamberDefinition("c1", "invented lab", null, [])], CancellationToken.None);
        await _store.SaveRunAsync(new RunRecord { Chamber = "c1", Name = "R-1", Wafers = ["W-1"], StartedAt = T0 }, CancellationToken.None);
        await _store.UpsertWaferAsync("W-1", null, "nw-test", CancellationToken.None);
        _data = new StoreWaferData(_store);
    }

    public Task DisposeAsync()
    {
        _store.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
        return Task.CompletedTask;
    }

    [Fact]
    public async Task GetWaferAsync_WithReports_ShowsVerdictReasonsStatisticsAndWires()
    {
        string reports = Path.Combine(_folder, "reports", "W-1");
        Directory.CreateDirectory(reports);
        string csv = Path.Combine(reports, "W-1-wires.csv");
        await File.WriteAllTextAsync(csv, "wafer_id,field,wire,x_nm,y_nm,radius_nm,normalised_area,predicted_radius_nm,vertical\r\n"
            + "W-1,\"f,1.png\",1,10,20,31.5,0.4,30.9,true\r\nW-1,f2.png,2,30,40,28,0.3,27.5,true\r\n");
        const string summary = """
            {"statistics":{"count":2,"meanRadiusNm":29.75,"radiusSdNm":2.47,"densityPerCm2":1.1e9},
             "verdict":{"outcome":"Warn","rules":[{"rule":"wire-count","outcome":"Pass","reason":"enough"},
                                                  {"rule":"mean-radius","outcome":"Warn","reason":"mean radius 29.75 nm is 5.25 nm from the target"}]}}
            """;
        await _store.SaveReportAsync(new WaferReportRecord(0, "W-1", T0, "warn", "json", Path.Combine(reports, "W-1.json"), summary), CancellationToken.None);
        await _store.SaveReportAsync(new WaferReportRecord(0, "W-1", T0, "warn", "csv", csv, null), CancellationToken.None);
        var (field, _) = await _store.AddFieldAsync(new FieldRecord { Wafer = "W-1", FilePath = "/drop/f1.png", RelativePath = "f1.png", Sha256 = "ab", ImportedAt = T0, NmPerPx = 4 }, CancellationToken.None);
        await _store.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, StartedAt = T0, Status = "done", WireCount = 321 }, CancellationToken.None);

        WaferDetail? wafer = await _data.GetWaferAsync("W-1", CancellationToken.None);

        Assert.NotNull(wafer);
        Assert.Equal("R-1", wafer!.RunId);
        Assert.Equal(VerdictOutcome.Review, wafer.Verdict!.Outcome);
        Assert.Equal(["warn: mean radius 29.75 nm is 5.25 nm from the target"], wafer.Verdict.Reasons);
        Assert.Equal(11.0, wafer.Statistics!.DensityPerSquareMicrometre, 9); // 1.1e9 cm⁻² = 11 µm⁻²
        Assert.Equal(2, wafer.Wires.Count);
        Assert.Equal(31.5, wafer.Wires[0].RadiusNm);
        Assert.Equal(30.9, wafer.Wires[0].PredictedRadiusNm);
        Assert.Equal(321, Assert.Single(wafer.Fields).WireCount);
        Assert.Equal(["csv", "json"], wafer.ReportFormats);
        ReportFile? file = await _data.GetReportAsync("W-1", "csv", CancellationToken.None);
        Assert.Equal("text/csv; charset=utf-8", file!.ContentType);
        Assert.Null(await _data.GetReportAsync("W-1", "pdf", CancellationToken.None));
    }

    [Fact]
    public async Task GetFieldImageAsync_ReportsInARevisionFolder_OverlayFromTheWaferFolder()
    {
        // Reports are issued into reports/W-2/r1/ (marked by revision.json); overlays stay in reports/W-2/fields/.
        string wafer = Path.Combine(_folder, "reports", "W-2");
        string revision = Path.Combine(wafer, "r1");
        Directory.CreateDirectory(revision);
        await File.WriteAllTextAsync(Path.Combine(revision, WaferFiles.RevisionManifestName), "{}");
        await _store.SaveReportAsync(new WaferReportRecord(0, "W-2", T0, "pass", "pdf", Path.Combine(revision, "W-2-r1.pdf"), null), CancellationToken.None);
        var (field, _) = await _store.AddFieldAsync(new FieldRecord { Wafer = "W-2", FilePath = "/drop/w2.tif", RelativePath = "w2.tif", Sha256 = "ef", ImportedAt = T0 }, CancellationToken.None);
        string overlay = WaferFiles.OverlayPath(wafer, field.Id);
        Directory.CreateDirectory(Path.GetDirectoryName(overlay)!);
        byte[] png = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A, 1, 2, 3];
        await File.WriteAllBytesAsync(overlay, png);

        ReportFile? image = await _data.GetFieldImageAsync(field.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), overlay: true, CancellationToken.None);

        Assert.NotNull(image);
        Assert.Equal(png, image!.Content);
    }

    [Fact]
    public async Task GetWaferAsync_StoredResultsWithDroplets_ShowsWireAndDropletRadiusPerFieldAndPooled()
    {
        // Invented results as the pipeline stores them (Storage's FieldResultJson): field 1 has two droplet-bearing
        // wires, field 2 one bare droplet without a wire radius (no contact angle) and one wire without a droplet.
        FieldWire[] first = [new(1, 0, 0, 30, true, true, null, 21), new(2, 0, 0, 32, true, true, null, 23), new(3, 0, 0, 31, true, true, null)];
        FieldWire[] second = [new(1, 0, 0, double.NaN, true, true, null, 44), new(2, 0, 0, 29, true, true, null)];
        int n = 0;
        foreach (FieldWire[] wires in new[] { first, second })
        {
            n++;
            var (field, _) = await _store.AddFieldAsync(new FieldRecord { Wafer = "W-1", FilePath = $"/drop/d{n}.png", RelativePath = $"d{n}.png", Sha256 = $"d{n}", ImportedAt = T0, NmPerPx = 4 }, CancellationToken.None);
            var result = new FieldResult { FieldName = $"d{n}.png", PixelSizeNm = 4, WidthNm = 4000, AnalysedHeightNm = 3000, Threshold = "1 (otsu)", AnalysedAreaCm2 = 1.2e-7, Wires = wires };
            await _store.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, StartedAt = T0, Status = "done", WireCount = wires.Length, ResultsJson = FieldResultJson.Write(result) }, CancellationToken.None);
        }

        WaferDetail? wafer = await _data.GetWaferAsync("W-1", CancellationToken.None);

        WaferDroplets droplets = wafer!.Droplets!;
        Assert.Equal(["d1.png", "d2.png"], droplets.Fields.Select(f => f.FileName));
        Assert.Equal(31, droplets.Fields[0].Figures.MeanWireRadiusNm, 12);
        Assert.Equal(22, droplets.Fields[0].Figures.MeanDropletRadiusNm, 12);
        Assert.Equal(0, droplets.Fields[1].Figures.WithBoth);
        Assert.Equal(3, droplets.Wafer.WithDroplet);
        Assert.Equal(2, droplets.Wafer.WithBoth);
        Assert.Equal(44, droplets.Wafer.MeanDropletOnlyRadiusNm, 12);
    }

    [Fact]
    public async Task UnmatchedFieldsAndModelAcceptance_ReadAndRecorded()
    {
        await _store.AddFieldAsync(new FieldRecord { FilePath = "/drop/x.png", RelativePath = "x.png", Sha256 = "cd", ImportedAt = T0, Problem = "no wafer id in the file name or sidecar" }, CancellationToken.None);
        await _store.SaveModelFitAsync(new ModelFitRecord
        {
            Process = "nw-test", Model = "radius", FittedAt = T0, RSquared = 0.9, RmseNm = 1.5, Wafers = ["W-1"],
            ParamsJson = """{"kind":"PowerLaw","parameters":[{"name":"k","value":55.4},{"name":"p","value":0.51}],"count":700}""",
        }, CancellationToken.None);

        var unmatched = Assert.Single(await _data.GetUnmatchedFieldsAsync(CancellationToken.None));
        Assert.Equal("no wafer id in the file name or sidecar", unmatched.Reason);
        Assert.Equal(["nw-test"], await _data.GetProcessesAsync(CancellationToken.None));
        ProcessModelView? before = await _data.GetProcessModelAsync("nw-test", CancellationToken.None);
        Assert.Equal(RadiusModelForm.PowerLaw, before!.Current.Form);
        Assert.Equal(55.4, before.Current.A);
        Assert.Null(before.AcceptedBy);

        await _data.AcceptModelAsync("nw-test", "engineer1", CancellationToken.None);

        Assert.Equal("engineer1", (await _data.GetProcessModelAsync("nw-test", CancellationToken.None))!.AcceptedBy);
        await Assert.ThrowsAsync<InvalidOperationException>(() => _data.AcceptModelAsync("nw-test", "engineer1", CancellationToken.None));
    }
}
