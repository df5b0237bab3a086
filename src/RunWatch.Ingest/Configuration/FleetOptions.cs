using System.ComponentModel.DataAnnotations;

namespace RunWatch.Ingest.Configuration;

/// <summary>
/// Fleet mode, bound from the <c>Fleet</c> section: several daemons share one PostgreSQL store and one broker, and each
/// chamber is owned by one daemon at a time (docs/fleet.md). Off by default (one box, SQLite).
/// </summary>
public sealed class FleetOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Fleet";

    /// <summary>Turns fleet mode on. Needs <c>Storage:Provider=PostgreSql</c> and <c>Broker:Mode=External</c>. <value>Default false.</value></summary>
    public bool Enabled { get; set; }

    /// <summary>How often a daemon checks the chambers it owns and tries to take free ones. <value>Default 1 s.</value></summary>
    public TimeSpan ClaimInterval { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>
    /// Keepalive of the ownership connection, on both sides: a daemon cut off from the database without its socket
    /// closing loses its chambers after about 2.5 x this. <value>Default 5 s.</value>
    /// </summary>
    public TimeSpan LockKeepAlive { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>Longest an ownership probe may take before the daemon counts its chambers lost. <value>Default 5 s.</value></summary>
    public TimeSpan LockCommandTimeout { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>
    /// Most chambers this daemon takes while others are free (0 = no limit), to spread chambers over the fleet; a
    /// daemon at its limit still keeps what it owns. Set it so that the other daemons together can take every
    /// chamber when one of them is down. <value>Default 0.</value>
    /// </summary>
    [Range(0, int.MaxValue)]
    public int MaxOwnedChambers { get; set; }

    /// <summary>At a takeover without an open run, how far back stored samples are replayed into the alarms. <value>Default 10 min.</value></summary>
    public TimeSpan ReplayWindow { get; set; } = TimeSpan.FromMinutes(10);

    /// <summary>Most stored samples per channel replayed at a takeover. <value>Default 500 000.</value></summary>
    [Range(1, int.MaxValue)]
    public int ReplayMaxSamples { get; set; } = 500_000;

    /// <summary>MQTT client id of a chamber's session; <c>{site}</c> and <c>{chamber}</c> are replaced. <value>Default <c>runwatch-chamber-{site}-{chamber}</c>.</value></summary>
    [Required]
    public string ChamberClientId { get; set; } = "runwatch-chamber-{site}-{chamber}";

    /// <summary>The chamber session's client id for one chamber.</summary>
    public string ClientIdFor(string site, string chamber) => ChamberClientId.Replace("{site}", site, StringComparison.Ordinal).Replace("{chamber}", chamber, StringComparison.Ordinal);
}
