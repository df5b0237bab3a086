using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Pipeline;

/// <summary>Turns committed batches (ids) into named samples for every <see cref="IIngestCommitListener"/>.</summary>
internal sealed class CommitListenerBridge(ChamberRegistryHolder registry, IEnumerable<IIngestCommitListener> listeners) : ICommittedBatchObserver
{
    private readonly IIngestCommitListener[] _listeners = [.. listeners];

    public void OnCommitted(IngestBatch batch, IReadOnlyList<ChamberEvent> events, DateTimeOffset committedAt)
    {
        if (_listeners.Length == 0 || !registry.IsReady)
        {
            return;
        }
        var samples = new List<CommittedSample>(batch.SampleCount);
        ReadOnlySpan<SampleRow> rows = batch.Samples;
        ReadOnlySpan<bool> inserted = batch.Inserted;
        for (int i = 0; i < rows.Length; i++)
        {
            if (!inserted[i])
            {
                continue;
            }
            ChamberRuntime? chamber = registry.Registry.Find(rows[i].ChamberId);
            ChannelRuntime? channel = chamber?.FindChannel(rows[i].ChannelId);
            if (chamber is not null && channel is not null)
            {
                samples.Add(new CommittedSample(chamber.Name, channel.Name, UnixMicros.ToDateTimeOffset(rows[i].TimestampUs), rows[i].Value));
            }
        }
        var chambers = new HashSet<string>(StringComparer.Ordinal);
        foreach (ChamberEvent e in events)
        {
            if (registry.Registry.Find(e.ChamberId) is { } c)
            {
                chambers.Add(c.Name);
            }
        }
        if (samples.Count == 0 && chambers.Count == 0)
        {
            return;
        }
        foreach (IIngestCommitListener listener in _listeners)
        {
            try
            {
                listener.Committed(samples, chambers);
            }
            catch (Exception ex) when (ex is InvalidOperationException or ObjectDisposedException)
            {
                // A live view that fails must never hold up ingest; it catches up on its next query.
            }
        }
    }
}
