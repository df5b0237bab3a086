using System.Diagnostics;
using System.Globalization;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;

namespace RunWatch.Benchmarks;

/// <summary>
/// The committer's SQLite write on its own, in process: batches of 1,000 samples through
/// <see cref="SqliteRunWatchStore.WriteBatchAsync"/>, against a peer that writes the same rows into the same schema
/// the common ADO.NET way (one prepared Microsoft.Data.Sqlite command, named parameters, one transaction per batch).
/// Both use WAL and synchronous=FULL on the same disk, so the fsync per commit is in both figures.
/// </summary>
internal sealed class StoreWriteBenchmark : IBenchmark
{
    private const int BatchSize = 1000;

    public string Name => "store-write";

    public string Description => "SQLite batch write of telemetry samples: RunWatch store vs a plain prepared ADO.NET insert";

    public int Run(bool quick, TextWriter output) => RunAsync(quick, output).GetAwaiter().GetResult();

    private static async Task<int> RunAsync(bool quick, TextWriter output)
    {
        int total = quick ? 100_000 : 1_000_000;
        string folder = Directory.CreateTempSubdirectory("runwatch-store-bench-").FullName;
        try
        {
            var options = new StorageOptions { DataDirectory = folder, DatabaseFile = "runwatch.db" };
            using var store = new SqliteRunWatchStore(Options.Create(options), TimeProvider.System);
            await store.MigrateAsync(CancellationToken.None);
            var chambers = await store.RegisterChambersAsync(
                [new ChamberDefinition("B1", "bench", "invented benchmark chamber", [new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1500, [])])],
                CancellationToken.None);
            long chamberId = chambers[0].ChamberId;
            long channelId = chambers[0].Channels[0].ChannelId;
            long t0 = UnixMicros.From(new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero));

            // Warm-up: JIT and statement preparation, not counted.
            var batch = new IngestBatch(BatchSize);
            Fill(batch, chamberId, channelId, t0, -BatchSize);
            await store.WriteBatchAsync(batch, CancellationToken.None);

            long allocatedBefore = GC.GetAllocatedBytesForCurrentThread();
            var clock = Stopwatch.StartNew();
            for (int start = 0; start < total; start += BatchSize)
            {
                Fill(batch, chamberId, channelId, t0, start);
                await store.WriteBatchAsync(batch, CancellationToken.None);
            }
            double storeS = clock.Elapsed.TotalSeconds;
            double allocatedPerSample = (GC.GetAllocatedBytesForCurrentThread() - allocatedBefore) / (double)total;

            string peerPath = Path.Combine(folder, "peer.db");
            double peerS = PeerWrite(peerPath, total, chamberId, channelId, t0);

            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   {total:N0} samples in batches of {BatchSize:N0}, WAL, synchronous=FULL, one transaction per batch"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   RunWatch store (bound by position, SQLitePCLRaw): {total / storeS,12:N0} samples/s  ({storeS:F2} s; {allocatedPerSample:F1} B allocated per sample on the writing thread)"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   peer: prepared ADO.NET command, named params:     {total / peerS,12:N0} samples/s  ({peerS:F2} s)"));
            output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   ratio RunWatch / peer: {peerS / storeS:F2}x"));
            return 0;
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            Directory.Delete(folder, recursive: true);
        }
    }

    private static void Fill(IngestBatch batch, long chamberId, long channelId, long t0, int start)
    {
        batch.Clear();
        for (int i = 0; i < BatchSize; i++)
        {
            long n = start + i;
            batch.AddSample(new SampleRow(chamberId, channelId, t0 + (n * 100_000), n, 600 + ((n % 50) * 0.1)));
        }
    }

    private static double PeerWrite(string path, int total, long chamberId, long channelId, long t0)
    {
        using var connection = new SqliteConnection("Data Source=" + path + ";Pooling=False");
        connection.Open();
        using (var setup = connection.CreateCommand())
        {
            setup.CommandText = """
                PRAGMA journal_mode=WAL; PRAGMA synchronous=FULL;
                CREATE TABLE samples (chamber_id INTEGER NOT NULL, channel_id INTEGER NOT NULL, t_us INTEGER NOT NULL, seq INTEGER NOT NULL,
                    value REAL NOT NULL, PRIMARY KEY (chamber_id, channel_id, t_us, seq)) WITHOUT ROWID;
                """;
            setup.ExecuteNonQuery();
        }
        using var insert = connection.CreateCommand();
        insert.CommandText = "INSERT OR IGNORE INTO samples (chamber_id, channel_id, t_us, seq, value) VALUES ($c, $ch, $t, $s, $v)";
        var c = insert.Parameters.Add("$c", SqliteType.Integer);
        var ch = insert.Parameters.Add("$ch", SqliteType.Integer);
        var t = insert.Parameters.Add("$t", SqliteType.Integer);
        var s = insert.Parameters.Add("$s", SqliteType.Integer);
        var v = insert.Parameters.Add("$v", SqliteType.Real);
        insert.Prepare();
        var clock = Stopwatch.StartNew();
        for (int start = 0; start < total; start += BatchSize)
        {
            using var transaction = connection.BeginTransaction();
            insert.Transaction = transaction;
            for (int i = 0; i < BatchSize; i++)
            {
                long n = start + i;
                c.Value = chamberId;
                ch.Value = channelId;
                t.Value = t0 + (n * 100_000);
                s.Value = n;
                v.Value = 600 + ((n % 50) * 0.1);
                insert.ExecuteNonQuery();
            }
            transaction.Commit();
        }
        return clock.Elapsed.TotalSeconds;
    }
}
