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
    private readonly System.Collections.Concurrent.ConcurrentDictionary<long, byte> _runningIds = new();

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

    /// <summary>Whether this daemon is analysing the field now.</summary>
    public bool IsRunning(long fieldId) => _runningIds.ContainsKey(fieldId);

    internal void Started(long fieldId)
    {
        _runningIds[fieldId] = 0;
        Interlocked.Increment(ref _running);
    }

    internal void Finished(long fieldId, bool ok)
    {
        _runningIds.TryRemove(fieldId, out _);
        Interlocked.Decrement(ref _running);
        Interlocked.Increment(ref ok ? ref _done : ref _failed);
    }

    /// <summary>True when nothing waits or runs.</summary>
    public bool Idle => Waiting == 0 && Running == 0;
}
