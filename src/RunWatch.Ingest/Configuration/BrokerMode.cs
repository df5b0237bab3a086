namespace RunWatch.Ingest.Configuration;

/// <summary>Which broker the daemon uses.</summary>
public enum BrokerMode
{
    /// <summary>An MQTTnet broker inside the daemon, bound to loopback by default. Sessions live in memory only.</summary>
    Embedded = 0,

    /// <summary>Any external MQTT 3.1.1 or 5 broker (e.g. Mosquitto with persistence), recommended for production.</summary>
    External,
}
