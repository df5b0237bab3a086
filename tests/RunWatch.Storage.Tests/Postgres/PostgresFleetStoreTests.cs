using Microsoft.Extensions.Options;
using Npgsql;
using RunWatch.Storage.Postgres;
using RunWatch.Testing.Postgres;

namespace RunWatch.Storage.Tests.Postgres;

/// <summary>What only a shared server asks of the store: several daemons at once, and a server that goes away.</summary>
public sealed class PostgresFleetStoreTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    private static PostgresRunWatchStore Open(string connectionString) =>
        new(Options.Create(new StorageOptions { Provider = "PostgreSql", ConnectionString = connectionString }), TimeProvider.System);

    [Fact]
    public async Task MigrateAsync_FourDaemonsStartTogether_SchemaAppliedOnce()
    {
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("migrate");
        try
        {
            var stores = Enumerable.Range(0, 4).Select(_ => Open(database)).ToArray();
            int[] applied = await Task.WhenAll(stores.Select(s => Task.Run(() => s.MigrateAsync(CancellationToken.None))));
            foreach (var store in stores)
            {
                await store.DisposeAsync();
            }

            int scripts = PostgresMigrator.LoadScripts().Count;
            Assert.Equal(scripts, applied.Sum());
            Assert.Equal(scripts, applied.Max());
            Assert.Equal(scripts, await CountAsync(database, "SELECT COUNT(*) FROM schema_migrations"));
        }
        finally
        {
            await server.DropDatabaseAsync(database);
        }
    }

    [Fact]
    public async Task WriteBatchAsync_TwoDaemonsWriteOverlappingBatches_EachSampleStoredOnceAndNewExactlyOnce()
    {
        // A chamber's messages redelivered to the next owner while the old one still commits: both stores write
        // overlapping batches at the same time; across both, every sample must be reported new exactly once.
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("overlap");
        try
        {
            await using var first = Open(database);
            await using var second = Open(database);
            await first.MigrateAsync(CancellationToken.None);
            var chamber = (await first.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None))[0];
            await second.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
            long channel = chamber.Channels[0].ChannelId;
            const int Total = 20_000;
            const int BatchSize = 500;

            async Task<int> WriteAllAsync(PostgresRunWatchStore store, int start)
            {
                int newRows = 0;
                var batch = new IngestBatch(BatchSize);
                for (int b = 0; b < Total / BatchSize; b++)
                {
                    batch.Clear();
                    for (int i = 0; i < BatchSize; i++)
                    {
                        int n = (start + (b * BatchSize) + i) % Total;
                        batch.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddMilliseconds(n)), n, n));
                    }
                    newRows += (await store.WriteBatchAsync(batch, CancellationToken.None)).SamplesInserted;
                }
                return newRows;
            }

            int[] inserted = await Task.WhenAll(Task.Run(() => WriteAllAsync(first, 0)), Task.Run(() => WriteAllAsync(second, Total / 3)));

            Assert.Equal(Total, inserted.Sum());
            Assert.Equal(Total, await CountAsync(database, "SELECT COUNT(*) FROM samples"));
            Assert.Equal(Total, await CountAsync(database, "SELECT COUNT(DISTINCT seq) FROM samples WHERE value = seq"));
        }
        finally
        {
            await server.DropDatabaseAsync(database);
        }
    }

    [Fact]
    public async Task WriteBatchAsync_ServerRestartedBetweenBatches_ThrowsStoreUnavailableThenWritesAgain()
    {
        await using var server = await PostgresServer.StartOwnAsync();
        string database = await server.CreateDatabaseAsync("restart");
        await using var store = Open(database);
        await store.MigrateAsync(CancellationToken.None);
        var chamber = (await store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None))[0];
        var batch = new IngestBatch();
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0), 1, 600));
        await store.WriteBatchAsync(batch, CancellationToken.None);

        // A fast restart cuts the store's ingest session; the next write on it fails as a store failure (nothing
        // kept, the committer retries) and the one after it opens a new session.
        await server.RestartAsync();
        batch.Clear();
        batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Channels[0].ChannelId, UnixMicros.From(T0.AddSeconds(1)), 2, 601));
        await Assert.ThrowsAsync<StoreUnavailableException>(() => store.WriteBatchAsync(batch, CancellationToken.None));
        var retried = await store.WriteBatchAsync(batch, CancellationToken.None);

        Assert.Equal(1, retried.SamplesInserted);
        Assert.Equal(2, await CountAsync(database, "SELECT COUNT(*) FROM samples"));
    }

    [Fact]
    public async Task ClaimQueuedFieldAsync_SixWorkersOnTwoDaemons_EveryFieldClaimedExactlyOnce()
    {
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("claims");
        try
        {
            await using var first = Open(database);
            await using var second = Open(database);
            await first.MigrateAsync(CancellationToken.None);
            const int Fields = 300;
            for (int i = 0; i < Fields; i++)
            {
                await first.AddFieldAsync(new FieldRecord
                {
                    Wafer = "W-" + (i % 7).ToString(System.Globalization.CultureInfo.InvariantCulture),
                    FilePath = "/drop/f" + i.ToString(System.Globalization.CultureInfo.InvariantCulture) + ".tif",
                    RelativePath = "f" + i.ToString(System.Globalization.CultureInfo.InvariantCulture) + ".tif",
                    Sha256 = i.ToString("x64", System.Globalization.CultureInfo.InvariantCulture),
                    ImportedAt = T0,
                    Status = FieldStatus.Queued,
                }, CancellationToken.None);
            }

            async Task<List<long>> WorkAsync(PostgresRunWatchStore store, string worker)
            {
                var mine = new List<long>();
                while (await store.ClaimQueuedFieldAsync(worker, T0, TimeSpan.FromHours(1), CancellationToken.None) is { } field)
                {
                    mine.Add(field.Id);
                    await store.UpdateFieldAsync(field with { Status = FieldStatus.Analysed }, CancellationToken.None);
                }
                return mine;
            }

            var workers = Enumerable.Range(0, 6).Select(w => Task.Run(() => WorkAsync(w % 2 == 0 ? first : second, "worker-" + w.ToString(System.Globalization.CultureInfo.InvariantCulture))));
            var claimed = (await Task.WhenAll(workers)).SelectMany(ids => ids).ToList();

            Assert.Equal(Fields, claimed.Count);
            Assert.Equal(Fields, claimed.Distinct().Count());
            Assert.Equal(0, await CountAsync(database, "SELECT COUNT(*) FROM fields WHERE status = 'Queued'"));
        }
        finally
        {
            await server.DropDatabaseAsync(database);
        }
    }

    private static async Task<long> CountAsync(string connectionString, string sql)
    {
        await using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(connectionString) { Pooling = false }.ConnectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        return Convert.ToInt64(await command.ExecuteScalarAsync(), System.Globalization.CultureInfo.InvariantCulture);
    }
}
