using RunWatch.Ingest.Mqtt;
using RunWatch.Ingest.Pipeline;

namespace RunWatch.Ingest.Fleet;

/// <summary>
/// Sends each committed message's PUBACK on the chamber session it came in on (its connection generation says
/// which); acks of a session that is gone or reconnected are dropped, and the broker redelivers those messages to
/// whoever owns the chamber then. Tickets of no chamber session go to the daemon's own connection.
/// </summary>
internal sealed class FleetAcknowledger(FleetState fleet, MqttConnectionService daemonConnection) : IMessageAcknowledger
{
    private readonly HashSet<long> _generations = [];

    public async ValueTask<int> AcknowledgeAsync(ReadOnlyMemory<AcknowledgementTicket> tickets, CancellationToken cancellationToken)
    {
        // One pass per connection (a batch holds few), each in ticket order, so every session's acks stay in order
        // and leave in one socket write.
        _generations.Clear();
        var span = tickets.Span;
        for (int i = 0; i < span.Length; i++)
        {
            _generations.Add(span[i].Generation);
        }
        int sent = 0;
        bool daemonTickets = false;
        foreach (long generation in _generations)
        {
            if (fleet.SessionOf(generation) is { } session)
            {
                sent += await session.AcknowledgeAsync(tickets, generation, cancellationToken).ConfigureAwait(false);
            }
            else
            {
                daemonTickets = true;
            }
        }
        if (daemonTickets)
        {
            sent += await daemonConnection.AcknowledgeAsync(tickets, cancellationToken).ConfigureAwait(false);
        }
        return sent;
    }
}
