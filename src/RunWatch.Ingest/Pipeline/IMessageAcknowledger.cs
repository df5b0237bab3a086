namespace RunWatch.Ingest.Pipeline;

/// <summary>Sends the broker's acknowledgement of a message once its samples are committed.</summary>
internal interface IMessageAcknowledger
{
    /// <summary>Acknowledges the message behind <paramref name="ticket"/>; false when it could not be (stale connection, send failed). Never throws.</summary>
    ValueTask<bool> AcknowledgeAsync(AcknowledgementTicket ticket, CancellationToken cancellationToken);
}
