namespace RunWatch.Ingest.Mqtt;

/// <summary>Publishes the daemon's own messages (alerts, status) on its broker connection.</summary>
internal interface IMqttPublisher
{
    /// <summary>Publishes at QoS 1; false when not connected or the broker refused. Never throws except on cancellation.</summary>
    Task<bool> TryPublishAsync(string topic, ReadOnlyMemory<byte> payload, bool retain, CancellationToken cancellationToken);
}
