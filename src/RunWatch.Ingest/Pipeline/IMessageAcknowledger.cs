namespace RunWatch.Ingest.Pipeline;

/// <summary>Sends the broker's acknowledgement of a message once its samples are committed.</summary>
internal interface IMessageAcknowledger
{
    /// <summary>Acknowledges <paramref name="message"/>; false when it could not be (stale connection, send failed). Never throws.</summary>
    ValueTask<bool> AcknowledgeAsync(InboundMessage message, CancellationToken cancellationToken);
}
