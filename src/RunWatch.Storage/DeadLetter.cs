namespace RunWatch.Storage;

/// <summary>A rejected message kept for inspection. The table is bounded; the oldest rows go first.</summary>
/// <param name="ReceivedAt">When the daemon received it.</param>
/// <param name="Topic">MQTT topic.</param>
/// <param name="Reason">Reject reason code, e.g. <c>malformed_json</c>.</param>
/// <param name="Detail">Human-readable detail, may be null.</param>
/// <param name="Payload">The payload, possibly truncated to the configured bound.</param>
/// <param name="PayloadLength">Length of the original payload in bytes.</param>
public sealed record DeadLetter(DateTimeOffset ReceivedAt, string Topic, string Reason, string? Detail, ReadOnlyMemory<byte> Payload, int PayloadLength);
