using System.Globalization;
using System.Threading.Channels;
using Microsoft.Extensions.Options;
using RunWatch.Storage.Postgres;
using RunWatch.Testing.Postgres;

namespace RunWatch.Storage.Tests.Postgres;

/// <summary>
/// Commit notifications between two store instances on one real PostgreSQL (two daemons of a fleet): what one
/// commits reaches the other's listener, read back from the store. Truth is the batch the test itself wrote.
/// </summary>
public sealed class PostgresCommitListenerTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(60);

    private static PostgresRunWatchStore Open(string connectionString) =>
        new(Options.Create(new StorageOptions { Provider = "PostgreSql", ConnectionString = connectionString }), TimeProvider.System);

    [Fact]
    public async Task RunAsync_OtherInstanceCommits_ListenerGetsExactlyTheNewSamples()
    {
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("notify");
        using var stop = new CancellationTokenSource();
        try
        {
            await using var owner = Open(database);
            await using var viewer = Open(database);
            await owner.MigrateAsync(CancellationToken.None);
            var chamber = (await owner.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None))[0];
            await viewer.RegisterChambersAsync([TempDatabase.Chamber()], CancellationToken.None);
            long tc = chamber.Channels[0].ChannelId;
            long sp = chamber.Channels[1].ChannelId;
            long shutter = chamber.Channels[2].ChannelId;

            var heard = Channel.CreateUnbounded<CommittedSamples>();
            var listener = new PostgresCommitListener(viewer, TimeProvider.System);
            var listening = listener.RunAsync(c => heard.Writer.TryWrite(c), stop.Token);
            await listener.Listening.WaitAsync(Patience);

            // The viewer's own commit comes first: its listener must skip it (its daemon pushed those itself).
            var own = new IngestBatch();
            own.AddSample(new SampleRow(chamber.ChamberId, shutter, UnixMicros.From(T0), 1, 1));
            await viewer.WriteBatchAsync(own, CancellationToken.None);

            var batch = new IngestBatch();
            for (int i = 0; i < 50; i++)
            {
                batch.AddSample(new SampleRow(chamber.ChamberId, tc, UnixMicros.From(T0.AddSeconds(i)), i, 600 + (0.5 * i)));
                batch.AddSample(new SampleRow(chamber.ChamberId, sp, UnixMicros.From(T0.AddSeconds(i)), i, 610));
            }
            await owner.WriteBatchAsync(batch, CancellationToken.None);

            var first = await heard.Reader.ReadAsync().AsTask().WaitAsync(Patience);
            var second = await heard.Reader.ReadAsync().AsTask().WaitAsync(Patience);
            var byChannel = new[] { first, second }.ToDictionary(c => c.Channel, StringComparer.Ordinal);
            Assert.Equal(["substrate_sp", "substrate_tc"], byChannel.Keys.Order(StringComparer.Ordinal));
            Assert.All(byChannel.Values, c => Assert.Equal("C1", c.Chamber));
            Assert.Equal(Enumerable.Range(0, 50).Select(i => 600 + (0.5 * i)), byChannel["substrate_tc"].Samples.Select(s => s.Value));
            Assert.Equal(Enumerable.Range(0, 50).Select(i => T0.AddSeconds(i)), byChannel["substrate_tc"].Samples.Select(s => s.Timestamp));
            Assert.Equal(50, byChannel["substrate_sp"].Samples.Count);

            // A redelivered batch stores nothing new and so announces nothing: the next thing heard is the next sample.
            await owner.WriteBatchAsync(batch, CancellationToken.None);
            batch.Clear();
            batch.AddSample(new SampleRow(chamber.ChamberId, tc, UnixMicros.From(T0.AddSeconds(50)), 50, 625));
            await owner.WriteBatchAsync(batch, CancellationToken.None);
            var next = await heard.Reader.ReadAsync().AsTask().WaitAsync(Patience);
            Assert.Equal("substrate_tc", next.Channel);
            Assert.Equal([625.0], next.Samples.Select(s => s.Value));

            await stop.CancelAsync();
            await listening.WaitAsync(Patience);
            Assert.False(heard.Reader.TryRead(out _));
        }
        finally
        {
            await stop.CancelAsync();
            await server.DropDatabaseAsync(database);
        }
    }

    [Fact]
    public async Task RunAsync_BatchSpansMoreRangesThanOneNotificationHolds_EveryRangeHeard()
    {
        // 70 chambers x 3 channels: about 8,400 bytes of ranges, over PostgreSQL's 8000-byte NOTIFY payload limit
        // (CONFIRMED, PostgreSQL documentation of NOTIFY), so the store must split them.
        var server = await PostgresServer.SharedAsync();
        string database = await server.CreateDatabaseAsync("notifybig");
        using var stop = new CancellationTokenSource();
        try
        {
            await using var owner = Open(database);
            await using var viewer = Open(database);
            await owner.MigrateAsync(CancellationToken.None);
            var chambers = await owner.RegisterChambersAsync(
                [.. Enumerable.Range(0, 70).Select(i => TempDatabase.Chamber("C" + i.ToString("D2", CultureInfo.InvariantCulture)))], CancellationToken.None);

            var heard = Channel.CreateUnbounded<CommittedSamples>();
            var listener = new PostgresCommitListener(viewer, TimeProvider.System);
            var listening = listener.RunAsync(c => heard.Writer.TryWrite(c), stop.Token);
            await listener.Listening.WaitAsync(Patience);

            var batch = new IngestBatch();
            var expected = new HashSet<string>(StringComparer.Ordinal);
            foreach (var chamber in chambers)
            {
                foreach (var channel in chamber.Channels)
                {
                    batch.AddSample(new SampleRow(chamber.ChamberId, channel.ChannelId, UnixMicros.From(T0), 1, 1));
                    batch.AddSample(new SampleRow(chamber.ChamberId, channel.ChannelId, UnixMicros.From(T0.AddMinutes(10)), 2, 2));
                    expected.Add(chamber.Definition.Name + "/" + channel.Definition.Name);
                }
            }
            await owner.WriteBatchAsync(batch, CancellationToken.None);

            var got = new HashSet<string>(StringComparer.Ordinal);
            while (got.Count < expected.Count)
            {
                var c = await heard.Reader.ReadAsync().AsTask().WaitAsync(Patience);
                Assert.True(got.Add(c.Chamber + "/" + c.Channel), "heard twice: " + c.Chamber + "/" + c.Channel);
                Assert.Equal([1.0, 2.0], c.Samples.Select(s => s.Value));
            }
            Assert.Equal(expected, got);
            await stop.CancelAsync();
            await listening.WaitAsync(Patience);
        }
        finally
        {
            await stop.CancelAsync();
            await server.DropDatabaseAsync(database);
        }
    }
}
