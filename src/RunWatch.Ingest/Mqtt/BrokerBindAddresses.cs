using System.Net;
using System.Net.Sockets;

namespace RunWatch.Ingest.Mqtt;

/// <summary>
/// The addresses the embedded broker listens on, one per address family; <see cref="IPAddress.None"/> means "no
/// listener of that family". MQTTnet opens an IPv6 listener on every address (<c>::</c>) unless told otherwise, so both
/// families are always set explicitly.
/// </summary>
internal readonly record struct BrokerBindAddresses(IPAddress V4, IPAddress V6)
{
    /// <summary>
    /// <c>localhost</c> binds both loopback addresses (127.0.0.1 and ::1); an IPv4 literal binds that address only;
    /// an IPv6 literal binds that address only (<c>::</c> is every IPv6 address, and IPv4 through mapped addresses).
    /// </summary>
    /// <exception cref="ArgumentException">The value is neither <c>localhost</c> nor an IP address literal.</exception>
    public static BrokerBindAddresses Parse(string host)
    {
        ArgumentNullException.ThrowIfNull(host);
        string trimmed = host.Trim();
        if (string.Equals(trimmed, "localhost", StringComparison.OrdinalIgnoreCase))
        {
            return new BrokerBindAddresses(IPAddress.Loopback, IPAddress.IPv6Loopback);
        }
        if (trimmed.StartsWith('[') && trimmed.EndsWith(']'))
        {
            trimmed = trimmed[1..^1];
        }
        if (!IPAddress.TryParse(trimmed, out var address))
        {
            throw new ArgumentException("Broker:Host must be an IP address or \"localhost\" for the embedded broker (it is the address it listens on); got \"" + host + "\"", nameof(host));
        }
        return address.AddressFamily == AddressFamily.InterNetworkV6
            ? new BrokerBindAddresses(IPAddress.None, address)
            : new BrokerBindAddresses(address, IPAddress.None);
    }

    /// <summary>The listening addresses for logs, e.g. <c>127.0.0.1, ::1</c>.</summary>
    public override string ToString()
    {
        if (V4.Equals(IPAddress.None))
        {
            return V6.ToString();
        }
        return V6.Equals(IPAddress.None) ? V4.ToString() : V4 + ", " + V6;
    }
}
