using System.Buffers;
using System.Threading.Channels;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// The bounded queue between the MQTT callback (many writers in principle, one in practice) and the single committer.
/// When it is full the callback waits, which stops the client reading and leaves further messages with the broker.
/// </summary>
internal sealed class InboundQueue
{
    private readonly Channel<InboundMessage> _channel;
    private readonly IngestOptions _options;
    private readonly int _headBytes;
    private readonly TimeProvider _timeProvider;

    public InboundQueue(IOptions<IngestOptions> options, IOptions<StorageOptions> storageOptions, TimeProvider timeProvider)
    {
        _options = options.Value;
        _headBytes = storageOptions.Value.DeadLetterPayloadBytes;
        _timeProvider = timeProvider;
        _channel = Channel.CreateBounded<InboundMessage>(new BoundedChannelOptions(_options.QueueCapacity)
        {
            SingleReader = true,
            SingleWriter = false,
            FullMode = BoundedChannelFullMode.Wait,
        });
    }

    public ChannelReader<InboundMessage> Reader => _channel.Reader;

    public int Count => _channel.Reader.Count;

    /// <summary>Copies the payload into a pooled buffer and queues it, waiting while the queue is full.</summary>
    public ValueTask EnqueueAsync(string topic, ReadOnlySequence<byte> payload, object? ackHandle, long generation, CancellationToken cancellationToken)
    {
        int length = checked((int)Math.Min(payload.Length, int.MaxValue));
        int copy = length > _options.MaxPayloadBytes ? Math.Min(length, _headBytes) : length;
        byte[] buffer = ArrayPool<byte>.Shared.Rent(Math.Max(copy, 1));
        payload.Slice(0, copy).CopyTo(buffer);
        var message = new InboundMessage(topic, buffer, copy, length, _timeProvider.GetUtcNow(), _timeProvider.GetTimestamp(), ackHandle, generation);
        return _channel.Writer.WriteAsync(message, cancellationToken);
    }

    /// <summary>Queues a payload given as bytes (tests, replay of stored input).</summary>
    public ValueTask EnqueueAsync(string topic, ReadOnlyMemory<byte> payload, object? ackHandle, long generation, CancellationToken cancellationToken) =>
        EnqueueAsync(topic, new ReadOnlySequence<byte>(payload), ackHandle, generation, cancellationToken);

    public static void Release(in InboundMessage message) => ArrayPool<byte>.Shared.Return(message.Buffer);
}
