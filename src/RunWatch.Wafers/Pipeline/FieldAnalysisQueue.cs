using System.Threading.Channels;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// The bounded queue of fields waiting for analysis, with counters for the dashboard and health. Intake waits
/// when it is full (back-pressure) rather than dropping a field.
/// </summary>
public sealed class FieldAnalysisQueue
{
    private readonly Channel<long> _channel;
    private long _enqueued;
    private long _done;
    private long _failed;
    private int _running;

    public FieldAnalysisQueue(int capacity)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 1);
        Capacity = capacity;
        _channel = Channel.CreateBounded<long>(new BoundedChannelOptions(capacity)
        {
            FullMode = BoundedChannelFullMode.Wait,
            SingleReader = true,
        });
    }

    public int Capacity { get; }

    /// <summary>Fields waiting.</summary>
    public int Waiting => _channel.Reader.Count;

    /// <summary>Fields being analysed now.</summary>
    public int Running => Volatile.Read(ref _running);

    public long Enqueued => Interlocked.Read(ref _enqueued);

    public long Done => Interlocked.Read(ref _done);

    public long Failed => Interlocked.Read(ref _failed);

    /// <summary>Queues a field id for analysis, waiting while the queue is full.</summary>
    public async ValueTask EnqueueAsync(long fieldId, CancellationToken cancellationToken)
    {
        await _channel.Writer.WriteAsync(fieldId, cancellationToken).ConfigureAwait(false);
        Interlocked.Increment(ref _enqueued);
    }

    internal ChannelReader<long> Reader => _channel.Reader;

    internal void Started() => Interlocked.Increment(ref _running);

    internal void Finished(bool ok)
    {
        Interlocked.Decrement(ref _running);
        Interlocked.Increment(ref ok ? ref _done : ref _failed);
    }

    /// <summary>True when nothing waits or runs.</summary>
    public bool Idle => Waiting == 0 && Running == 0;
}
