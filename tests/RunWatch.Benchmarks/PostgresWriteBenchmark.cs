using System.Diagnostics;
using System.Globalization;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using Npgsql;
using NpgsqlTypes;
using RunWatch.Storage;
using RunWatch.Storage.Postgres;
using RunWatch.Storage.Sqlite;
using RunWatch.Testing.Postgres;

namespace RunWatch.Benchmarks;

/// <summary>
/// The PostgreSQL store's sample write on its own: the same stream in batches of 1,000 (the committer's default
/// batch) through each of the store's idempotent write paths, against a plain binary COPY of the same rows into
/// the same table (one COPY and commit per batch, no conflict handling: the floor of what any idempotent path can
/// cost), and against the SQLite store (synchronous=FULL) on the same disk. A fresh database per path.
/// </summary>
internal sealed class PostgresWriteBenchmark : IBenchmark
{
    private const int BatchSize = 1000;

    public string Name => "pg-write";

    public string Description => "PostgreSQL batch write of samples: unnest / COPY+staging / multi-row INSERT vs a plain COPY, and vs the SQLite store";

    public int Run(bool quick, TextWriter output) => RunAsync(quick, output).GetAwaiter().GetResult();

    private static async Task<int> RunAsync(bool quick, TextWriter output)
    {
        int total = quick ? 100_000 : 1_000_000;
        var server = await PostgresServer.SharedAsync().ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"   {total:N0} samples in batches of {BatchSize:N0}, one transaction per batch; PostgreSQL 15 defaults (fsync on, synchronous_commit on)"));
        double copyRate = await PlainCopyAsync(server, total).ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   plain binary COPY per batch (peer, no idempotence): {copyRate,12:N0} samples/s"));
        foreach (var method in new[] { PostgresSampleWrite.UnnestArrays, PostgresSampleWrite.CopyStaging, PostgresSampleWrite.MultiRowInsert })
        {
            var (rate, redeliveredRate) = await StoreWriteAsync(server, total, method).ConfigureAwait(false);
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"   store, {method,-15} new rows: {rate,12:N0} samples/s  ratio to COPY {rate / copyRate:F2}; all redelivered: {redeliveredRate,10:N0} samples/s"));
        }
        double sqliteRate = await SqliteWriteAsync(total).ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   SQLite store (WAL, synchronous=FULL), same batches: {sqliteRate,12:N0} samples/s"));
        return 0;
    }

    private static async Task<(double Rate, double RedeliveredRate)> StoreWriteAsync(PostgresServer server, int total, PostgresSampleWrite method)
    {
        string database = await server.CreateDatabaseAsync("bench").ConfigureAwait(false);
        try
        {
            await using var store = new PostgresRunWatchStore(Options.Create(new StorageOptions
            {
                Provider = "PostgreSql", ConnectionString = database, PostgresSampleWrite = method,
            }), TimeProvider.System);
            await store.MigrateAsync(CancellationToken.None).ConfigureAwait(false);
            var (chamberId, channelId) = await RegisterAsync(store).ConfigureAwait(false);
            var batch = new IngestBatch(BatchSize);
            Fill(batch, chamberId, channelId, -BatchSize);
            await store.WriteBatchAsync(batch, CancellationToken.None).ConfigureAwait(false);
            var clock = Stopwatch.StartNew();
            for (int start = 0; start < total; start += BatchSize)
            {
                Fill(batch, chamberId, channelId, start);
                await store.WriteBatchAsync(batch, CancellationToken.None).ConfigureAwait(false);
            }
            double rate = total / clock.Elapsed.TotalSeconds;
            // The same stream again (a broker redelivering after a takeover): every row is a duplicate.
            int again = total / 5;
            clock.Restart();
            for (int start = 0; start < again; start += BatchSize)
            {
                Fill(batch, chamberId, channelId, start);
                await store.WriteBatchAsync(batch, CancellationToken.None).ConfigureAwait(false);
            }
            return (rate, again / clock.Elapsed.TotalSeconds);
        }
        finally
        {
            await server.DropDatabaseAsync(database).ConfigureAwait(false);
        }
    }

    private static async Task<double> PlainCopyAsync(PostgresServer server, int total)
    {
        string database = await server.CreateDatabaseAsync("bench").ConfigureAwait(false);
        try
        {
            // The store's own schema (same primary key, same index), so the peer pays the same index maintenance.
            long chamberId;
            long channelId;
            await using (var store = new PostgresRunWatchStore(Options.Create(new StorageOptions { Provider = "PostgreSql", ConnectionString = database }), TimeProvider.System))
            {
                await store.MigrateAsync(CancellationToken.None).ConfigureAwait(false);
                (chamberId, channelId) = await RegisterAsync(store).ConfigureAwait(false);
            }
            await using var connection = new NpgsqlConnection(database);
            await connection.OpenAsync().ConfigureAwait(false);
            await CopyBatchAsync(connection, chamberId, channelId, -BatchSize).ConfigureAwait(false);
            var clock = Stopwatch.StartNew();
            for (int start = 0; start < total; start += BatchSize)
            {
                await CopyBatchAsync(connection, chamberId, channelId, start).ConfigureAwait(false);
            }
            return total / clock.Elapsed.TotalSeconds;
        }
        finally
        {
            await server.DropDatabaseAsync(database).ConfigureAwait(false);
        }
    }

    private static async Task CopyBatchAsync(NpgsqlConnection connection, long chamberId, long channelId, int start)
    {
        await using var transaction = await connection.BeginTransactionAsync().ConfigureAwait(false);
        await using (var importer = await connection.BeginBinaryImportAsync("COPY samples (chamber_id, channel_id, t_us, seq, value) FROM STDIN (FORMAT BINARY)").ConfigureAwait(false))
        {
            for (int i = 0; i < BatchSize; i++)
            {
                long n = start + i;
                await importer.StartRowAsync().ConfigureAwait(false);
                await importer.WriteAsync(chamberId, NpgsqlDbType.Bigint).ConfigureAwait(false);
                await importer.WriteAsync(channelId, NpgsqlDbType.Bigint).ConfigureAwait(false);
                await importer.WriteAsync(TimeOf(n), NpgsqlDbType.Bigint).ConfigureAwait(false);
                await importer.WriteAsync(n, NpgsqlDbType.Bigint).ConfigureAwait(false);
                await importer.WriteAsync(ValueOf(n), NpgsqlDbType.Double).ConfigureAwait(false);
            }
            await importer.CompleteAsync().ConfigureAwait(false);
        }
        await transaction.CommitAsync().ConfigureAwait(false);
    }

    private static async Task<double> SqliteWriteAsync(int total)
    {
        string folder = Directory.CreateTempSubdirectory("runwatch-pg-bench-sqlite-").FullName;
        try
        {
            using var store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = folder, DatabaseFile = "runwatch.db" }), TimeProvider.System);
            await store.MigrateAsync(CancellationToken.None).ConfigureAwait(false);
            var (chamberId, channelId) = await RegisterAsync(store).ConfigureAwait(false);
            var batch = new IngestBatch(BatchSize);
            Fill(batch, chamberId, channelId, -BatchSize);
            await store.WriteBatchAsync(batch, CancellationToken.None).ConfigureAwait(false);
            var clock = Stopwatch.StartNew();
            for (int start = 0; start < total; start += BatchSize)
            {
                Fill(batch, chamberId, channelId, start);
                await store.WriteBatchAsync(batch, CancellationToken.None).ConfigureAwait(false);
            }
            return total / clock.Elapsed.TotalSeconds;
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            Directory.Delete(folder, recursive: true);
        }
    }

    private static async Task<(long ChamberId, long ChannelId)> RegisterAsync(IRunWatchStore store)
    {
        var chambers = await store.RegisterChambersAsync(
            [new ChamberDefinition("B1", "bench", "invented benchmark chamber", [new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1500, [])])],
            CancellationToken.None).ConfigureAwait(false);
        return (chambers[0].ChamberId, chambers[0].Channels[0].ChannelId);
    }

    private static void Fill(IngestBatch batch, long chamberId, long channelId, int start)
    {
        batch.Clear();
        for (int i = 0; i < BatchSize; i++)
        {
            long n = start + i;
            batch.AddSample(new SampleRow(chamberId, channelId, TimeOf(n), n, ValueOf(n)));
        }
    }

    private static long TimeOf(long n) => UnixMicros.From(new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero)) + (n * 100_000);

    private static double ValueOf(long n) => 600 + ((n % 50) * 0.1);
}
