namespace RunWatch.Storage.Tests.Contract;

/// <summary>The <see cref="IWaferStore"/> contract: every test body runs against SQLite and PostgreSQL.</summary>
public sealed class WaferStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    private static async Task<StoreUnderTest> OpenAsync(StoreKind kind)
    {
        var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(default);
        await db.Store.RegisterChambersAsync([TempDatabase.Chamber()], default);
        return db;
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

    [Theory]
    [AllStores]
    public async Task AddFieldAsync_SameBytesTwice_StoredOnce(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var (first, added1) = await db.Wafers.AddFieldAsync(Field("aa", "W-1"), default);
        var (second, added2) = await db.Wafers.AddFieldAsync(Field("aa", "W-1") with { RelativePath = "copy.png" }, default);

        Assert.True(added1);
        Assert.False(added2);
        Assert.Equal(first.Id, second.Id);
        Assert.Equal("aa.png", second.RelativePath);
        Assert.Equal(1, await db.CountAsync("SELECT COUNT(*) FROM fields"));
        Assert.Equal("W-1", (await db.Wafers.GetWaferAsync("W-1", default))!.Name);
    }

    [Theory]
    [AllStores]
    public async Task UpdateFieldAsync_UnassignedFieldAssigned_MovesToWafer(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var (field, _) = await db.Wafers.AddFieldAsync(Field("bb"), default);
        Assert.Single(await db.Wafers.GetFieldsByStatusAsync(FieldStatus.Unassigned, 10, default));

        await db.Wafers.UpdateFieldAsync(field with { Wafer = "W-2", Status = FieldStatus.Queued }, default);

        Assert.Empty(await db.Wafers.GetFieldsByStatusAsync(FieldStatus.Unassigned, 10, default));
        var ofWafer = Assert.Single(await db.Wafers.GetFieldsOfWaferAsync("W-2", default));
        Assert.Equal(FieldStatus.Queued, ofWafer.Status);
    }

    [Theory]
    [AllStores]
    public async Task FindRunOfWaferAsync_TwoWafersInOneRun_BothFindIt(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var run = await db.Store.SaveRunAsync(new RunRecord { Chamber = "C1", Name = "R0412", Wafers = ["W-0412-A", "W-0412-B"], StartedAt = T0 }, default);

        Assert.Equal(run.Id, (await db.Wafers.FindRunOfWaferAsync("W-0412-A", default))!.Id);
        Assert.Equal(run.Id, (await db.Wafers.FindRunOfWaferAsync("W-0412-B", default))!.Id);
        Assert.Null(await db.Wafers.FindRunOfWaferAsync("W-9999", default));
    }

    [Theory]
    [AllStores]
    public async Task SaveAnalysisAsync_Twice_LatestReturned(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var (field, _) = await db.Wafers.AddFieldAsync(Field("cc", "W-3"), default);
        await db.Wafers.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, StartedAt = T0, Status = "done", WireCount = 5 }, default);
        await db.Wafers.SaveAnalysisAsync(new AnalysisRecord { FieldId = field.Id, StartedAt = T0.AddMinutes(1), Status = "done", WireCount = 7, DiffusionLengthNm = 3000 }, default);

        var latest = await db.Wafers.GetLatestAnalysisAsync(field.Id, default);
        Assert.Equal(7, latest!.WireCount);
        Assert.Equal(3000, latest.DiffusionLengthNm);
    }

    [Theory]
    [AllStores]
    public async Task GetReportsAsync_SeveralWrites_NewestPerFormat(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        await db.Wafers.SaveReportAsync(new WaferReportRecord(0, "W-4", T0, "warn", "pdf", "a.pdf", null), default);
        await db.Wafers.SaveReportAsync(new WaferReportRecord(0, "W-4", T0.AddMinutes(1), "pass", "pdf", "b.pdf", null), default);
        await db.Wafers.SaveReportAsync(new WaferReportRecord(0, "W-4", T0.AddMinutes(1), "pass", "html", "b.html", null), default);

        var reports = await db.Wafers.GetReportsAsync("W-4", default);
        Assert.Equal(2, reports.Count);
        Assert.Contains(reports, r => r.Format == "pdf" && r.FilePath == "b.pdf");
    }

    [Theory]
    [AllStores]
    public async Task AcceptModelFitAsync_RecordsWho(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var fit = await db.Wafers.SaveModelFitAsync(new ModelFitRecord { Process = "nw-gaas", Model = "arrhenius", FittedAt = T0, ParamsJson = "{}", Wafers = ["W-1", "W-2"] }, default);
        Assert.Null(fit.AcceptedBy);

        var accepted = await db.Wafers.AcceptModelFitAsync(fit.Id, "engineer1", default);

        Assert.Equal("engineer1", accepted!.AcceptedBy);
        Assert.Equal(["W-1", "W-2"], accepted.Wafers);
        Assert.Null(await db.Wafers.AcceptModelFitAsync(9999, "x", default));
    }

    [Theory]
    [AllStores]
    public async Task ClaimQueuedFieldAsync_TwoWorkers_EachGetsAnotherFieldAndAnExpiredClaimIsTakenAgain(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var (first, _) = await db.Wafers.AddFieldAsync(Field("q1", "W-5"), default);
        await db.Wafers.AddFieldAsync(Field("u1"), default);
        var (second, _) = await db.Wafers.AddFieldAsync(Field("q2", "W-5"), default);
        var lease = TimeSpan.FromMinutes(5);

        var a = await db.Wafers.ClaimQueuedFieldAsync("daemon-a", T0, lease, default);
        var b = await db.Wafers.ClaimQueuedFieldAsync("daemon-b", T0, lease, default);
        var none = await db.Wafers.ClaimQueuedFieldAsync("daemon-b", T0.AddMinutes(1), lease, default);

        Assert.Equal(first.Id, a!.Id);
        Assert.Equal(second.Id, b!.Id);
        Assert.Null(none);

        // daemon-a finishes its field; daemon-b dies holding its claim, which runs out after the lease.
        await db.Wafers.UpdateFieldAsync(a with { Status = FieldStatus.Analysed }, default);
        Assert.Null(await db.Wafers.ClaimQueuedFieldAsync("daemon-a", T0.AddMinutes(4), lease, default));
        var retaken = await db.Wafers.ClaimQueuedFieldAsync("daemon-a", T0.AddMinutes(5), lease, default);
        Assert.Equal(second.Id, retaken!.Id);

        // Given back at once: claimable again before its lease ends, but not by the release of another worker.
        await db.Wafers.ReleaseFieldClaimAsync(second.Id, "daemon-b", default);
        Assert.Null(await db.Wafers.ClaimQueuedFieldAsync("daemon-b", T0.AddMinutes(6), lease, default));
        await db.Wafers.ReleaseFieldClaimAsync(second.Id, "daemon-a", default);
        Assert.Equal(second.Id, (await db.Wafers.ClaimQueuedFieldAsync("daemon-b", T0.AddMinutes(6), lease, default))!.Id);
    }

    [Theory]
    [AllStores]
    public async Task ClaimFieldAsync_TwoWorkersOneField_OnlyTheFirstUntilTheLeaseRunsOut(StoreKind kind)
    {
        await using var db = await OpenAsync(kind);
        var (field, _) = await db.Wafers.AddFieldAsync(Field("c1", "W-6"), default);
        var (unassigned, _) = await db.Wafers.AddFieldAsync(Field("c2"), default);
        var lease = TimeSpan.FromMinutes(15);

        Assert.True(await db.Wafers.ClaimFieldAsync(field.Id, "daemon-a", T0, lease, default));
        Assert.False(await db.Wafers.ClaimFieldAsync(field.Id, "daemon-b", T0.AddMinutes(1), lease, default));
        Assert.True(await db.Wafers.ClaimFieldAsync(field.Id, "daemon-a", T0.AddMinutes(2), lease, default));
        Assert.True(await db.Wafers.ClaimFieldAsync(field.Id, "daemon-b", T0.AddMinutes(17), lease, default));
        Assert.False(await db.Wafers.ClaimFieldAsync(unassigned.Id, "daemon-a", T0, lease, default));
        await db.Wafers.UpdateFieldAsync(field with { Status = FieldStatus.Analysed }, default);
        Assert.False(await db.Wafers.ClaimFieldAsync(field.Id, "daemon-c", T0.AddHours(2), lease, default));
    }
}
