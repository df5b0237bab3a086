using Microsoft.Extensions.Options;
using RunWatch.Storage.Postgres;
using RunWatch.Testing.Postgres;

namespace RunWatch.Storage.Tests.Postgres;

/// <summary>
/// The three sample write paths of the PostgreSQL store give the same stored rows and the same per-row "new" flags;
/// the expected flags are worked out here row by row, not by the store.
/// </summary>
public sealed class PostgresSampleWriteTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);

    [Theory]
    [InlineData(PostgresSampleWrite.UnnestArrays)]
    [InlineData(PostgresSampleWrite.CopyStaging)]
    [InlineData(PostgresSampleWrite.MultiRowInsert)]
    public async Task WriteBatchAsync_RedeliveredAndRepeatedRowsAcrossChunks_FlagsExactlyTheNewRows(PostgresSampleWrite method)
    {
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("write");
        try
        {
            await using var store = new PostgresRunWatchStore(Options.Create(new StorageOptions
            {
                Provider = "PostgreSql", ConnectionString = database, PostgresSampleWrite = method,
            }), TimeProvider.System);
            await store.MigrateAsync(CancellationToken.None);
            var chamber = (await store.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None))[0];
            long channel = chamber.Channels[0].ChannelId;

            // Every fifth row was stored by an earlier batch (a redelivery); 2,503 rows cross two full chunks of the
            // multi-row path and a tail; rows 2,500.. repeat rows 7, 8 and 10 within the batch with other values.
            var earlier = new IngestBatch();
            for (int i = 0; i < 2500; i += 5)
            {
                earlier.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddSeconds(i)), i, -1));
            }
            await store.WriteBatchAsync(earlier, CancellationToken.None);
            var batch = new IngestBatch();
            var expected = new List<bool>();
            for (int i = 0; i < 2500; i++)
            {
                batch.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddSeconds(i)), i, i));
                expected.Add(i % 5 != 0);
            }
            foreach (int repeat in new[] { 7, 8, 10 })
            {
                batch.AddSample(new SampleRow(chamber.ChamberId, channel, UnixMicros.From(T0.AddSeconds(repeat)), repeat, 1e6));
                expected.Add(false);
            }

            var result = await store.WriteBatchAsync(batch, CancellationToken.None);

            Assert.Equal(2000, result.SamplesInserted);
            Assert.Equal(503, result.SampleDuplicates);
            Assert.Equal(expected.ToArray(), batch.Inserted.ToArray());
            var read = await store.GetSamplesAsync("C1", "substrate_tc", T0, T0.AddSeconds(2500), 5000, CancellationToken.None);
            Assert.Equal(2500, read.Count);
            for (int i = 0; i < 2500; i++)
            {
                // The stored value is the first one sent: -1 for the earlier rows, i otherwise (never the 1e6 repeats).
                Assert.Equal(i % 5 == 0 ? -1 : i, read[i].Value);
            }
        }
        finally
        {
            await server.DropDatabaseAsync(database);
        }
    }
}
