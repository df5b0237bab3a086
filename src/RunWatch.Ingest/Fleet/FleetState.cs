using System.Collections.Concurrent;

namespace RunWatch.Ingest.Fleet;

/// <summary>What this daemon owns right now: the chamber sessions by connection generation (for acks) and by chamber.</summary>
internal sealed class FleetState
{
    private readonly ConcurrentDictionary<long, ChamberMqttSession> _byGeneration = new();
    private readonly ConcurrentDictionary<long, ChamberMqttSession> _byChamber = new();

    /// <summary>This daemon's instance name.</summary>
    public string Instance { get; set; } = "";

    /// <summary>When each owned chamber was taken.</summary>
    public ConcurrentDictionary<string, DateTimeOffset> OwnedSince { get; } = new(StringComparer.Ordinal);

    public void Route(ChamberMqttSession session, long generation) => _byGeneration[generation] = session;

    public ChamberMqttSession? SessionOf(long generation) => _byGeneration.GetValueOrDefault(generation);

    public void Add(ChamberMqttSession session)
    {
        _byChamber[session.Chamber.ChamberId] = session;
        session.Connected += Route;
        Route(session, session.Generation);
    }

    public ChamberMqttSession? Remove(long chamberId)
    {
        if (!_byChamber.TryRemove(chamberId, out var session))
        {
            return null;
        }
        session.Connected -= Route;
        foreach (var (generation, routed) in _byGeneration)
        {
            if (ReferenceEquals(routed, session))
            {
                _byGeneration.TryRemove(generation, out _);
            }
        }
        OwnedSince.TryRemove(session.Chamber.Name, out _);
        return session;
    }

    public bool Owns(long chamberId) => _byChamber.ContainsKey(chamberId);

    public IReadOnlyCollection<long> OwnedChamberIds => [.. _byChamber.Keys];
}
