namespace RunWatch.Ingest.Pipeline;

/// <summary>Sends the broker's acknowledgements of messages once their samples are committed.</summary>
internal interface IMessageAcknowledger
{
    /// <summary>
    /// Acknowledges the messages behind <paramref name="tickets"/>, in order; returns how many were sent (the rest:
    /// stale connection, send failed, and the broker redelivers them). Never throws.
    /// </summary>
    ValueTask<int> AcknowledgeAsync(ReadOnlyMemory<AcknowledgementTicket> tickets, CancellationToken cancellationToken);
}
