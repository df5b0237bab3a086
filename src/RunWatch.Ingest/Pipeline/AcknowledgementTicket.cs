namespace RunWatch.Ingest.Pipeline;

/// <summary>What is left of a committed message once its payload buffer has gone back to the pool: enough to send its PUBACK.</summary>
/// <param name="Handle">The acknowledger's handle for the message.</param>
/// <param name="Generation">Connection generation the message came in on.</param>
internal readonly record struct AcknowledgementTicket(object Handle, long Generation);
