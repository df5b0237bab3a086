using System.Text;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Prometheus;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Pipeline;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;

namespace RunWatch.Ingest.Tests.Pipeline;

public sealed class IngestPipelineTests
{
    [Fact]
    public async Task RunAsync_StoreFailsThenRecovers_NothingAckedBeforeCommitAlertRaisedThenCleared()
    {
        var store = new FlakyStore(failures: 3);
        var acks = new RecordingAcknowledger(store);
        var conditions = new RecordingConditions();
        var (pipeline, queue, health) = Build(store, acks, conditions);
        using var stop = new CancellationTokenSource();
        var running = pipeline.RunAsync(stop.Token);

        for (int i = 0; i < 5; i++)
        {
            await queue.EnqueueAsync("runwatch/lab/C1/telemetry", Encoding.UTF8.GetBytes(Line(i)), ackHandle: i, generation: 0, CancellationToken.None);
        }
        await Poll.UntilAsync(() => acks.Acked.Count == 5, TimeSpan.FromSeconds(20), "all five acknowledged");
        await stop.CancelAsync();
        await running;

        Assert.Equal(4, store.Attempts);
        Assert.Equal(5, store.Stored);
        Assert.All(acks.StoredWhenAcked, stored => Assert.True(stored >= 1, "an ack went out before its commit"));
        Assert.Equal(["unavailable", "recovered"], conditions.Calls);
        Assert.True(health.Snapshot().StoreWritable);
    }

    [Fact]
    public async Task RunAsync_MalformedAmongGood_AcknowledgesAllAndDeadLettersTheBadOne()
    {
        var store = new FlakyStore(failures: 0);
        var acks = new RecordingAcknowledger(store);
        var (pipeline, queue, _) = Build(store, acks, new RecordingConditions());
        using var stop = new CancellationTokenSource();
        var running = pipeline.RunAsync(stop.Token);

        await queue.EnqueueAsync("runwatch/lab/C1/telemetry", Encoding.UTF8.GetBytes(Line(1)), 1, 0, CancellationToken.None);
        await queue.EnqueueAsync("runwatch/lab/C1/telemetry", "{not json"u8.ToArray(), 2, 0, CancellationToken.None);
        await queue.EnqueueAsync("runwatch/lab/C1/telemetry", Encoding.UTF8.GetBytes(Line(3)), 3, 0, CancellationToken.None);
        await Poll.UntilAsync(() => acks.Acked.Count == 3, TimeSpan.FromSeconds(10), "all three acknowledged");
        await stop.CancelAsync();
        await running;

        Assert.Equal([1, 2, 3], acks.Acked);
        Assert.Equal(2, store.Stored);
        Assert.Equal("malformed_json", Assert.Single(store.DeadLetters).Reason);
    }

    [Fact]
    public async Task RunAsync_StoppedWithBatchesInFlight_AcknowledgesEveryCommittedMessageInOrderBeforeReturning()
    {
        var store = new FlakyStore(failures: 0);
        var acks = new RecordingAcknowledger(store);
        var (pipeline, queue, _) = Build(store, acks, new RecordingConditions());
        using var stop = new CancellationTokenSource();
        var running = pipeline.RunAsync(stop.Token);

        for (int i = 0; i < 2500; i++)
        {
            await queue.EnqueueAsync("runwatch/lab/C1/telemetry", Encoding.UTF8.GetBytes(Line(i)), ackHandle: i, generation: 0, CancellationToken.None);
        }
        await stop.CancelAsync();
        await running;

        // Whatever was committed before the stop (drain included) is acknowledged once, in commit order, and nothing else.
        Assert.Equal(store.Stored, acks.Acked.Count);
        Assert.Equal(Enumerable.Range(0, acks.Acked.Count), acks.Acked);
        Assert.True(store.Stored > 0);
    }

    private static (IngestPipeline, InboundQueue, IngestHealth) Build(IRunWatchStore store, IMessageAcknowledger acks, IDaemonConditions conditions)
    {
        var ingest = Options.Create(new IngestOptions { CommitRetryInitialDelay = TimeSpan.FromMilliseconds(20), CommitRetryMaxDelay = TimeSpan.FromMilliseconds(50) });
        var storage = Options.Create(new StorageOptions());
        var queue = new InboundQueue(ingest, storage, TimeProvider.System);
        var holder = new ChamberRegistryHolder();
        holder.Set(TestChambers.Registry());
        var health = new IngestHealth();
        var pipeline = new IngestPipeline(queue, store, holder, acks, [], [conditions], new IngestMetrics(Metrics.NewCustomRegistry()), health,
            ingest, storage, TimeProvider.System, NullLogger<IngestPipeline>.Instance);
        return (pipeline, queue, health);
    }

    private static string Line(int seq) =>
        "{\"t\":\"" + DateTimeOffset.UtcNow.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", System.Globalization.CultureInfo.InvariantCulture) + "\",\"seq\":" + seq + ",\"values\":{\"substrate_tc\":600}}";

    private sealed class RecordingConditions : IDaemonConditions
    {
        public List<string> Calls { get; } = [];

        public void StoreUnavailable(string error) => Calls.Add("unavailable");

        public void StoreRecovered() => Calls.Add("recovered");
    }

    private sealed class RecordingAcknowledger(FlakyStore store) : IMessageAcknowledger
    {
        public List<int> Acked { get; } = [];

        public List<int> StoredWhenAcked { get; } = [];

        public ValueTask<int> AcknowledgeAsync(ReadOnlyMemory<AcknowledgementTicket> tickets, CancellationToken cancellationToken)
        {
            lock (Acked)
            {
                foreach (var ticket in tickets.Span)
                {
                    Acked.Add((int)ticket.Handle);
                    StoredWhenAcked.Add(store.Stored);
                }
            }
            return ValueTask.FromResult(tickets.Length);
        }
    }

    /// <summary>A store whose first writes fail as a full disk would; it keeps samples in memory.</summary>
    private sealed class FlakyStore(int failures) : IRunWatchStore
    {
        private int _failures = failures;

        public int Attempts { get; private set; }

        public int Stored { get; private set; }

        public List<DeadLetter> DeadLetters { get; } = [];

        public Task<BatchWriteResult> WriteBatchAsync(IngestBatch batch, CancellationToken cancellationToken)
        {
            Attempts++;
            if (_failures-- > 0)
            {
                throw new StoreUnavailableException("database or disk is full");
            }
            batch.InsertedForWrite.Fill(true);
            Stored += batch.SampleCount;
            DeadLetters.AddRange(batch.DeadLetters);
            return Task.FromResult(new BatchWriteResult(batch.SampleCount, 0, 0, 0, batch.DeadLetters.Count));
        }

        public Task<int> MigrateAsync(CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<RegisteredChamber>> RegisterChambersAsync(IReadOnlyList<ChamberDefinition> chambers, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<RegisteredChamber>> ListChambersAsync(CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<SampleRecord>> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<EventRecord>> GetEventsAsync(string chamber, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<RunRecord> SaveRunAsync(RunRecord run, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<RunRecord?> GetRunAsync(long id, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<RunRecord>> ListRunsAsync(string? chamber, DateTimeOffset? startedBefore, int maxCount, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<RunRecord>> GetOpenRunsAsync(CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<AlertRecord> SaveAlertAsync(AlertRecord alert, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<AlertRecord?> GetAlertAsync(long id, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<AlertRecord>> GetActiveAlertsAsync(CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<AlertRecord>> GetAlertHistoryAsync(DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<DeadLetterRecord>> GetDeadLettersAsync(int maxCount, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task AppendAuditAsync(AuditEntry entry, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxCount, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task<PruneResult> PruneAsync(RetentionPolicy policy, CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task MaintainAsync(CancellationToken cancellationToken) => throw new NotSupportedException();

        public Task ProbeWriteAsync(CancellationToken cancellationToken) => throw new NotSupportedException();
    }
}
