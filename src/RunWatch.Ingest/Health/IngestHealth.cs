using RunWatch.Storage;

namespace RunWatch.Ingest.Health;

/// <summary>Live state for /healthz: broker connection, store writability, ingest lag. Thread-safe (writes are single fields).</summary>
public sealed class IngestHealth
{
    private readonly Lock _gate = new();
    private BrokerConnectionState _brokerState;
    private DateTimeOffset _brokerStateSince;
    private string? _brokerError;
    private DateTimeOffset? _lastCommitAt;
    private string? _storeError;
    private int _consecutiveCommitFailures;
    private double _lastBatchLatencyMs;
    private double _lastSampleLagMs;
    private long _committedMessages;

    /// <summary>Queue depth provider, set by the ingest pipeline.</summary>
    internal Func<int>? QueueDepth { get; set; }

    /// <summary>A consistent copy of the state.</summary>
    public IngestHealthSnapshot Snapshot()
    {
        lock (_gate)
        {
            return new IngestHealthSnapshot(_brokerState, _brokerStateSince, _brokerError, _lastCommitAt, _storeError is null,
                _storeError, _consecutiveCommitFailures, QueueDepth?.Invoke() ?? 0, _lastBatchLatencyMs, _lastSampleLagMs, _committedMessages);
        }
    }

    internal void SetBroker(BrokerConnectionState state, DateTimeOffset since, string? error)
    {
        lock (_gate)
        {
            _brokerState = state;
            _brokerStateSince = since;
            _brokerError = error;
        }
    }

    internal void CommitSucceeded(DateTimeOffset at, int messages, double batchLatencyMs, double sampleLagMs)
    {
        lock (_gate)
        {
            _lastCommitAt = at;
            _storeError = null;
            _consecutiveCommitFailures = 0;
            _lastBatchLatencyMs = batchLatencyMs;
            _lastSampleLagMs = sampleLagMs;
            _committedMessages += messages;
        }
    }

    internal void CommitFailed(StoreUnavailableException error)
    {
        lock (_gate)
        {
            _storeError = error.Message;
            _consecutiveCommitFailures++;
        }
    }
}
