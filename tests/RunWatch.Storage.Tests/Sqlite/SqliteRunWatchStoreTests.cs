namespace RunWatch.Storage.Tests.Sqlite;

public sealed class SqliteRunWatchStoreTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task MaintainAsync_ReaderHoldsSnapshotWhileIdle_CheckpointReturnsAndWritesGoOn()
    {
        // A dashboard page reading while ingest pauses must not stall the committer: a truncating checkpoint would
        // wait here for the reader (busy_timeout, set to a minute) while holding the write lock.
        using var db = new TempDatabase(o => { o.IdleCheckpointAfter = TimeSpan.Zero; o.BusyTimeout = TimeSpan.FromMinutes(1); });
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        for (int i = 0; i < 500; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0.AddSeconds(i)), i, 600));
        }
        await db.Store.WriteBatchAsync(batch, CancellationToken.None);
        using var reader = new Microsoft.Data.Sqlite.SqliteConnection("Data Source=" + db.Options.DatabasePath + ";Pooling=False");
        reader.Open();
        using var readTransaction = reader.BeginTransaction(deferred: true);
        using (var select = reader.CreateCommand())
        {
            select.Transaction = readTransaction;
            select.CommandText = "SELECT COUNT(*) FROM samples";
            Assert.Equal(500L, (long)select.ExecuteScalar()!);
        }

        // The store works synchronously under its async surface; run it on the pool so that the guard can fire.
        await Task.Run(() => db.Store.MaintainAsync(CancellationToken.None)).WaitAsync(TimeSpan.FromSeconds(30));
        var more = new IngestBatch();
        more.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0.AddSeconds(1000)), 1000, 601));
        var result = await Task.Run(() => db.Store.WriteBatchAsync(more, CancellationToken.None)).WaitAsync(TimeSpan.FromSeconds(30));

        Assert.Equal(1, result.SamplesInserted);
        readTransaction.Rollback();
        Assert.Equal(501, db.Count("SELECT COUNT(*) FROM samples"));
    }

    [Fact]
    public async Task WriteBatchAsync_DatabaseLockedByAnotherWriter_ThrowsStoreUnavailableAndRecovers()
    {
        using var db = new TempDatabase(o => o.BusyTimeout = TimeSpan.FromSeconds(1));
        var chamber = await RegisterAsync(db);
        var batch = new IngestBatch();
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0), 1, 1));

        // Another process holds the write lock: the store must fail the write after its busy timeout, not hang.
        using (var blocker = new Microsoft.Data.Sqlite.SqliteConnection("Data Source=" + db.Options.DatabasePath + ";Pooling=False"))
        {
            blocker.Open();
            using var lockCommand = blocker.CreateCommand();
            lockCommand.CommandText = "PRAGMA busy_timeout=0; BEGIN IMMEDIATE; INSERT INTO audit_entries (at_us, actor, action) VALUES (0, 'x', 'y');";
            lockCommand.ExecuteNonQuery();
            await Assert.ThrowsAsync<StoreUnavailableException>(() => db.Store.WriteBatchAsync(batch, CancellationToken.None));
        }

        var result = await db.Store.WriteBatchAsync(batch, CancellationToken.None);
        Assert.Equal(1, result.SamplesInserted);
    }

    private static async Task<RegisteredChamber> RegisterAsync(TempDatabase db)
    {
        await db.Store.MigrateAsync(CancellationToken.None);
        var chambers = await db.Store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
        var again = await db.Store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
        Assert.Equal(chambers[0].Channels[0].ChannelId, again[0].Channels[0].ChannelId);
        return chambers[0];
    }
}
