namespace RunWatch.Ingest.Health;

/// <summary>State of the daemon's MQTT connection.</summary>
public enum BrokerConnectionState
{
    /// <summary>Not connected; a reconnect is scheduled.</summary>
    Disconnected = 0,

    /// <summary>A connection attempt is under way.</summary>
    Connecting,

    /// <summary>Connected and subscribed.</summary>
    Connected,
}
