namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// A received MQTT message waiting in the ingest queue. <see cref="Buffer"/> is rented from the shared array pool and
/// returned by the committer; for an oversize payload only its head is copied.
/// </summary>
/// <param name="Topic">Topic.</param>
/// <param name="Buffer">Pooled buffer holding <paramref name="Length"/> payload bytes.</param>
/// <param name="Length">Bytes copied into the buffer.</param>
/// <param name="PayloadLength">Length of the payload as received.</param>
/// <param name="ReceivedAt">Arrival time.</param>
/// <param name="ReceivedTimestamp">Arrival as a <see cref="TimeProvider"/> timestamp, for latency.</param>
/// <param name="AckHandle">What the acknowledger needs to send the PUBACK (null when nothing is to be acknowledged).</param>
/// <param name="Generation">Connection generation the message came in on; acks of older generations are not sent.</param>
internal readonly record struct InboundMessage(
    string Topic,
    byte[] Buffer,
    int Length,
    int PayloadLength,
    DateTimeOffset ReceivedAt,
    long ReceivedTimestamp,
    object? AckHandle,
    long Generation)
{
    public ReadOnlySpan<byte> Payload => Buffer.AsSpan(0, Length);
}
