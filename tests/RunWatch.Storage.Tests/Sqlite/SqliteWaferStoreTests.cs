using RunWatch.Storage.Sqlite;
using Xunit;

namespace RunWatch.Storage.Tests.Sqlite;

public sealed class SqliteWaferStoreTests : IAsyncLifetime
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private readonly TempDatabase _db = new();
    private SqliteRunWatchStore Store => _db.Store;

    public async Task InitializeAsync()
    {
        await Store.MigrateAsync(default);
        await Store.RegisterChambersAsync([TempDatabase.Chamber()], default);
    }

    public Task DisposeAsync()
    {
        _db.Dispose();
        return Task.CompletedTask;
    }

    private static FieldRecord Field(string sha, string? wafer = null) => new()
    {
        Wafer = wafer,
        FilePath = "/drop/" + sha + ".png",
        RelativePath = sha + ".png",
        Sha256 = sha,
        SizeBytes = 10,
        ImportedAt = T0,
        Status = wafer is null ? FieldStatus.Unassigned : FieldStatus.Queued,
    };

    [Fact]
    public async Task AddFieldAsync_SameBytesTwice_StoredOnce()
    {
        var (first, added1) = await Store.AddFieldAsync(Field("aa", "W-1"), default);
        var (second, added2) = await Store.AddFieldAsync(Field("aa", "W-1") with { RelativePath = "copy.png" }, default);

        Assert.True(added1);
        Assert.False(added2);
        Assert.Equal(first.Id, second.Id);
        Assert.Equal("aa.png", second.RelativePath);
        Assert.Equal(1, _db.Count("SELECT COUNT(*) FROM fields"));
        Assert.Equal("W-1", (await Store.GetWaferAsync("W-1", default))!.Name);
    }

    [Fact]
    public async Task UpdateFieldAsync_UnassignedFieldAssigned_MovesToWafer()
    {
        var (field, _) = await Store.AddFieldAsync(Field("bb"), default);
        Assert.Single(await Store.GetFieldsByStatusAsync(FieldStatus.Unassigned, 10, default));

        await Store.UpdateFieldAsync(field with { Wafer = "W-2", Status = FieldStatus.Queued }, default);

        Assert.Empty(await Store.GetFieldsByStatusAsync(FieldStatus.Unassigned, 10, default));
        var ofWafer = Assert.Single(await Store.GetFieldsOfWaferAsync("W-2", default));
        Assert.Equal(FieldStatus.Queued, ofWafer.Status);
    }

    [Fact]
    public async Task FindRunOfWaferAsync_TwoWafersInOneRun_BothFindIt()
    {
        var run = await Store.SaveRunAsync(new RunRecord { Chamber = "C1", Name = "R0412", Wafers = ["W-0412-A", "W-0412-B"], StartedAt = T0 }, default);

        Assert.Equal(run.Id, (await Store.FindRunOfWaferAsync("W-0412-A", default))!.Id);
        Assert.Equal(run.Id, (await Store.FindRunOfWaferAsync("W-0412-B", default))!.Id);
        Assert.Null(await Store.FindRunOfWaferAsync("W-9999", default));
    }

    [Fact]
    public async Task SaveAnalysisAsync_Twice_LatestReturned()
    {
        var (field, _) = await Store.AddFieldAsync(Field("cc", "W-3"), default);
        await Store.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, StartedAt = T0, Status = "done", WireCount = 5 }, default);
        await Store.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, StartedAt = T0.AddMinutes(1), Status = "done", WireCount = 7, DiffusionLengthNm = 3000 }, default);

        var latest = await Store.GetLatestAnalysisAsync(field.Id, default);
        Assert.Equal(7, latest!.WireCount);
        Assert.Equal(3000, latest.DiffusionLengthNm);
    }

    [Fact]
    public async Task GetReportsAsync_SeveralWrites_NewestPerFormat()
    {
        await Store.SaveReportAsync(new WaferReportRecord(0, "W-4", T0, "warn", "pdf", "a.pdf", null), default);
        await Store.SaveReportAsync(new WaferReportRecord(0, "W-4", T0.AddMinutes(1), "pass", "pdf", "b.pdf", null), default);
        await Store.SaveReportAsync(new WaferReportRecord(0, "W-4", T0.AddMinutes(1), "pass", "html", "b.html", null), default);

        var reports = await Store.GetReportsAsync("W-4", default);
        Assert.Equal(2, reports.Count);
        Assert.Contains(reports, r => r.Format == "pdf" && r.FilePath == "b.pdf");
    }

    [Fact]
    public async Task AcceptModelFitAsync_RecordsWho()
    {
        var fit = await Store.SaveModelFitAsync(new ModelFitRecord { Process = "nw-gaas", Model = "arrhenius", FittedAt = T0, ParamsJson = "{}", Wafers = ["W-1", "W-2"] }, default);
        Assert.Null(fit.AcceptedBy);

        var accepted = await Store.AcceptModelFitAsync(fit.Id, "engineer1", default);

        Assert.Equal("engineer1", accepted!.AcceptedBy);
        Assert.Equal(["W-1", "W-2"], accepted.Wafers);
        Assert.Null(await Store.AcceptModelFitAsync(9999, "x", default));
    }
}
