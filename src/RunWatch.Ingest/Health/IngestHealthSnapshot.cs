namespace RunWatch.Ingest.Health;

/// <summary>A copy of <see cref="IngestHealth"/> at one instant.</summary>
/// <param name="BrokerState">Connection state.</param>
/// <param name="BrokerStateSince">Since when.</param>
/// <param name="BrokerError">Last connection error, if any (never contains credentials).</param>
/// <param name="LastCommitAt">Last successful commit.</param>
/// <param name="StoreWritable">False while commits fail.</param>
/// <param name="StoreError">Last store error while failing.</param>
/// <param name="ConsecutiveCommitFailures">Failed commit attempts in a row.</param>
/// <param name="QueueDepth">Messages waiting for the committer.</param>
/// <param name="LastBatchLatencyMs">Arrival of the batch's first message to its commit, ms.</param>
/// <param name="LastSampleLagMs">Commit time minus the newest sample time of the last batch, ms (includes any backlog at the broker).</param>
/// <param name="CommittedMessages">Messages committed since start.</param>
public sealed record IngestHealthSnapshot(
    BrokerConnectionState BrokerState,
    DateTimeOffset BrokerStateSince,
    string? BrokerError,
    DateTimeOffset? LastCommitAt,
    bool StoreWritable,
    string? StoreError,
    int ConsecutiveCommitFailures,
    int QueueDepth,
    double LastBatchLatencyMs,
    double LastSampleLagMs,
    long CommittedMessages);
