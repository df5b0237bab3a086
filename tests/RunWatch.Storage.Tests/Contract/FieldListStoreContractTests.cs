namespace RunWatch.Storage.Tests.Contract;

/// <summary>The <see cref="IFieldListStore"/> contract on SQLite and PostgreSQL: the newest fields of any state, newest first.</summary>
public sealed class FieldListStoreContractTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Theory]
    [AllStores]
    public async Task GetRecentFieldsAsync_ManyStates_NewestFirstAcrossStatesAndLimited(StoreKind kind)
    {
        await using var db = await StoreUnderTest.CreateAsync(kind);
        await db.Store.MigrateAsync(CancellationToken.None);
        await db.Wafers.UpsertWaferAsync("W-1", null, "p", CancellationToken.None);
        // Arrival order differs from id order: field "late" is stored first but arrived last.
        var plan = new (string Name, int Minutes, FieldStatus Status, string? Wafer)[]
        {
            ("late", 50, FieldStatus.Queued, "W-1"), ("a", 10, FieldStatus.Analysed, "W-1"), ("b", 20, FieldStatus.Failed, "W-1"),
            ("c", 30, FieldStatus.Unassigned, null), ("d", 40, FieldStatus.Analysed, "W-1"),
        };
        foreach (var (name, minutes, status, wafer) in plan)
        {
            await db.Wafers.AddFieldAsync(new FieldRecord
            {
                Wafer = wafer, FilePath = "/drop/" + name, RelativePath = name, Sha256 = "sha-" + name, ImportedAt = T0.AddMinutes(minutes), Status = status,
            }, CancellationToken.None);
        }

        var all = await db.Wafers.GetFieldsByStatusAsync(FieldStatus.Analysed, 10, CancellationToken.None);
        var recent = await ((IFieldListStore)db.Wafers).GetRecentFieldsAsync(3, CancellationToken.None);
        var every = await ((IFieldListStore)db.Wafers).GetRecentFieldsAsync(100, CancellationToken.None);

        Assert.Equal(2, all.Count);
        Assert.Equal(["late", "d", "c"], recent.Select(f => f.RelativePath));
        Assert.Equal(["late", "d", "c", "b", "a"], every.Select(f => f.RelativePath));
        Assert.Equal((FieldStatus.Queued, "W-1"), (every[0].Status, every[0].Wafer));
    }
}
