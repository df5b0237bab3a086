using System.Buffers;
using System.Diagnostics;
using System.Threading.Channels;

namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// Sends the PUBACKs of committed batches on its own loop, in commit order, so that the committer can parse and write
/// the next batch while the previous batch's acknowledgements go out one packet at a time. Only batches already
/// committed are ever submitted, so the durability rule holds: nothing is acknowledged before it is stored. The
/// hand-over is bounded; when acknowledging falls behind, the committer waits.
/// </summary>
internal sealed class AcknowledgementStage
{
    private readonly IMessageAcknowledger _acknowledger;
    private readonly IngestMetrics _metrics;
    private readonly Channel<(AcknowledgementTicket[] Tickets, int Count)> _committed =
        Channel.CreateBounded<(AcknowledgementTicket[], int)>(new BoundedChannelOptions(2) { SingleReader = true, SingleWriter = true });
    private long _sent;

    public AcknowledgementStage(IMessageAcknowledger acknowledger, IngestMetrics metrics)
    {
        _acknowledger = acknowledger;
        _metrics = metrics;
    }

    /// <summary>Acknowledgements sent so far (diagnostics).</summary>
    public long Sent => Interlocked.Read(ref _sent);

    /// <summary>Hands over the tickets of a committed batch; waits while two earlier batches are still being acknowledged.</summary>
    public ValueTask SubmitAsync(List<InboundMessage> committed)
    {
        int count = 0;
        foreach (var message in committed)
        {
            if (message.AckHandle is not null)
            {
                count++;
            }
        }
        if (count == 0)
        {
            return ValueTask.CompletedTask;
        }
        var tickets = ArrayPool<AcknowledgementTicket>.Shared.Rent(count);
        int i = 0;
        foreach (var message in committed)
        {
            if (message.AckHandle is { } handle)
            {
                tickets[i++] = new AcknowledgementTicket(handle, message.Generation);
            }
        }
        return _committed.Writer.WriteAsync((tickets, count), CancellationToken.None);
    }

    /// <summary>Sends acknowledgements until <see cref="Complete"/> has been called and everything submitted is sent.</summary>
    public async Task RunAsync()
    {
        var reader = _committed.Reader;
        while (await reader.WaitToReadAsync(CancellationToken.None).ConfigureAwait(false))
        {
            while (reader.TryRead(out var batch))
            {
                long started = Stopwatch.GetTimestamp();
                try
                {
                    int sent = await _acknowledger.AcknowledgeAsync(batch.Tickets.AsMemory(0, batch.Count), CancellationToken.None).ConfigureAwait(false);
                    if (sent < batch.Count)
                    {
                        _metrics.AckFailures.Inc(batch.Count - sent);
                    }
                    Interlocked.Add(ref _sent, sent);
                }
                finally
                {
                    ArrayPool<AcknowledgementTicket>.Shared.Return(batch.Tickets, clearArray: true);
                }
                _metrics.AckSeconds.Observe(Stopwatch.GetElapsedTime(started).TotalSeconds);
            }
        }
    }

    /// <summary>No more batches will be submitted; <see cref="RunAsync"/> returns once the last is acknowledged.</summary>
    public void Complete() => _committed.Writer.TryComplete();
}
