using System.ComponentModel.DataAnnotations;

namespace RunWatch.Ingest.Configuration;

/// <summary>Broker connection, bound from the <c>Broker</c> section.</summary>
public sealed class BrokerOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Broker";

    /// <summary>Embedded or external broker. <value>Default <see cref="BrokerMode.Embedded"/>.</value></summary>
    public BrokerMode Mode { get; set; } = BrokerMode.Embedded;

    /// <summary>Host of the broker to connect to (external), or the embedded broker's bind address. <value>Default 127.0.0.1.</value></summary>
    [Required]
    public string Host { get; set; } = "127.0.0.1";

    /// <summary>TCP port. <value>Default 1883.</value></summary>
    [Range(1, 65535)]
    public int Port { get; set; } = 1883;

    /// <summary>MQTT protocol: <c>V500</c> (MQTT 5) or <c>V311</c>. <value>Default V500.</value></summary>
    [RegularExpression("^(V500|V311)$")]
    public string ProtocolVersion { get; set; } = "V500";

    /// <summary>User name, or null for none. Keep it out of files under version control; use an environment variable.</summary>
    public string? Username { get; set; }

    /// <summary>Password, or null. Never logged. Supply it through <c>Broker__Password</c> or a systemd credential file.</summary>
    public string? Password { get; set; }

    /// <summary>Read the password from this file instead (e.g. a systemd credential); takes precedence over <see cref="Password"/>.</summary>
    public string? PasswordFile { get; set; }

    /// <summary>Use TLS. <value>Default false.</value></summary>
    public bool UseTls { get; set; }

    /// <summary>PEM file of the CA that signed the broker's certificate; null to use the system store.</summary>
    public string? CaFile { get; set; }

    /// <summary>PEM client certificate for mutual TLS, optional.</summary>
    public string? ClientCertificateFile { get; set; }

    /// <summary>PEM private key of the client certificate.</summary>
    public string? ClientKeyFile { get; set; }

    /// <summary>Client id; must be stable, the broker keeps the session under it. <value>Default <c>runwatch-daemon</c>.</value></summary>
    [Required]
    public string ClientId { get; set; } = "runwatch-daemon";

    /// <summary>Instance name in <c>{root}/daemon/{instance}/status</c>. <value>Default <c>default</c>.</value></summary>
    [Required]
    public string InstanceName { get; set; } = "default";

    /// <summary>MQTT keep-alive. <value>Default 30 s.</value></summary>
    public TimeSpan KeepAlive { get; set; } = TimeSpan.FromSeconds(30);

    /// <summary>
    /// How long the broker keeps the daemon's session (and queues its QoS 1 messages) while it is away. Must be
    /// non-zero for a persistent session under MQTT 5. <value>Default 7 days.</value>
    /// </summary>
    public TimeSpan SessionExpiry { get; set; } = TimeSpan.FromDays(7);

    /// <summary>Receive Maximum announced to the broker (MQTT 5): unacknowledged messages in flight. Must be ≥ Ingest:MaxBatchMessages, with room for the next batch to arrive while one commits. <value>Default 4000.</value></summary>
    [Range(1, 65535)]
    public int ReceiveMaximum { get; set; } = 4000;

    /// <summary>Timeout of one connection attempt. <value>Default 10 s.</value></summary>
    public TimeSpan ConnectTimeout { get; set; } = TimeSpan.FromSeconds(10);

    /// <summary>First delay after a failed connection; doubles with jitter up to <see cref="ReconnectMaxDelay"/>. <value>Default 1 s.</value></summary>
    public TimeSpan ReconnectInitialDelay { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>Longest delay between reconnection attempts. <value>Default 60 s.</value></summary>
    public TimeSpan ReconnectMaxDelay { get; set; } = TimeSpan.FromSeconds(60);

    /// <summary>Embedded broker: most messages queued per client before the oldest are dropped. <value>Default 1 000 000.</value></summary>
    [Range(1, int.MaxValue)]
    public int EmbeddedMaxPendingMessagesPerClient { get; set; } = 1_000_000;

    /// <summary>
    /// Largest MQTT packet the daemon accepts, bytes, announced to the broker at connect (MQTT 5 Maximum Packet Size):
    /// the broker does not send this client anything larger (Mosquitto drops such a message for this client only), so
    /// a 10 MB payload never reaches the daemon's memory. Keep it above <c>Ingest:MaxPayloadBytes</c> so that moderately
    /// oversize payloads still arrive and are counted as <c>oversize</c>; the broker's own limit (Mosquitto
    /// <c>message_size_limit</c>, deploy/mosquitto/runwatch.conf) refuses them from publishers. The embedded broker
    /// drops publishes larger than this for every subscriber. <value>Default 1 MiB + 64 KiB.</value>
    /// </summary>
    [Range(1024, 268_435_460)]
    public int MaximumPacketBytes { get; set; } = (1024 * 1024) + (64 * 1024);
}
