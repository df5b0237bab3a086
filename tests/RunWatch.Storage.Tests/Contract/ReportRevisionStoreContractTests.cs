namespace RunWatch.Storage.Tests.Contract;

/// <summary>The <see cref="IReportRevisionStore"/> contract on SQLite and PostgreSQL: numbered, never replaced, requests answered once.</summary>
public sealed class ReportRevisionStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Theory]
    [AllStores]
    public async Task AddReportRevisionAsync_TwoRevisionsAndADuplicateNumber_KeepsBothAndRefusesTheDuplicate(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        var first = Revision("W-7", 1, "first issue", "intake", "aa11");
        var request = await db.Revisions.AddReportRequestAsync(new ReportRequestRecord(0, "W-7", T0.AddHours(1), "eve-engineer", "re-analysis requested"), CancellationToken.None);
        await db.Revisions.AddReportRequestAsync(new ReportRequestRecord(0, "W-8", T0.AddHours(1), "intake", "new field"), CancellationToken.None);

        var stored1 = await db.Revisions.AddReportRevisionAsync(first, [], CancellationToken.None);
        var pendingBefore = await db.Revisions.GetPendingReportRequestsAsync("W-7", CancellationToken.None);
        var stored2 = await db.Revisions.AddReportRevisionAsync(Revision("W-7", 2, "re-analysis requested", "eve-engineer", "bb22"), [request.Id], CancellationToken.None);
        var duplicate = await db.Revisions.AddReportRevisionAsync(Revision("W-7", 2, "a second writer", "intake", "cc33"), [], CancellationToken.None);
        await db.ReopenAsync();
        var revisions = await db.Revisions.GetReportRevisionsAsync("W-7", CancellationToken.None);
        var pendingAfter = await db.Revisions.GetPendingReportRequestsAsync("W-7", CancellationToken.None);
        var otherPending = await db.Revisions.GetPendingReportRequestsAsync("W-8", CancellationToken.None);
        var byHash = await db.Revisions.FindReportRevisionAsync("bb22", CancellationToken.None);

        Assert.NotNull(stored1);
        Assert.NotNull(stored2);
        Assert.Null(duplicate); // the number was taken: nothing stored, nothing replaced
        Assert.Equal(2, await db.CountAsync("SELECT COUNT(*) FROM report_revisions"));
        Assert.Equal([1, 2], revisions.Select(r => r.Revision));
        Assert.Equal(("re-analysis requested", "eve-engineer"), (revisions[1].Reason, revisions[1].Requester));
        Assert.Equal(first.Inputs, revisions[0].Inputs);
        Assert.Equal(first.ConfigJson, revisions[0].ConfigJson);
        Assert.Equal(T0, revisions[0].CreatedAt);
        Assert.Single(pendingBefore);
        Assert.Empty(pendingAfter);
        Assert.Single(otherPending);
        Assert.Equal(2, byHash?.Revision);
        Assert.Null(await db.Revisions.FindReportRevisionAsync("ffff", CancellationToken.None));
    }

    private static ReportRevisionRecord Revision(string wafer, int number, string reason, string requester, string hash) => new()
    {
        Wafer = wafer,
        Revision = number,
        CreatedAt = T0.AddHours(number - 1),
        Reason = reason,
        Requester = requester,
        SoftwareVersion = "1.2.3",
        ConfigSha256 = "c0ffee",
        ConfigJson = "{\"minWires\":30}",
        ModelId = "radius fit #4",
        Inputs = [new ReportInputHash(11, "W-7_f1.png", "/drop/W-7_f1.png", "0123abcd"), new ReportInputHash(12, "W-7_f2.png", "/drop/W-7_f2.png", "4567ef01")],
        ContentSha256 = hash,
        Folder = "/data/reports/W-7/r" + number,
        Verdict = "pass",
        DigestJson = "{}",
    };
}
