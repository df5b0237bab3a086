using System.Diagnostics;
using System.Globalization;
using System.Net;
using System.Net.NetworkInformation;
using System.Net.Sockets;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Mqtt;
using RunWatch.Testing.Mqtt;
using Xunit.Abstractions;

namespace RunWatch.Ingest.Tests.Mqtt;

/// <summary>
/// The embedded broker listens on exactly the configured address. Checked with Debian's mosquitto_pub, a client
/// independent of MQTTnet, publishing at QoS 1 (success needs CONNACK and PUBACK).
/// </summary>
public sealed class EmbeddedBrokerBindingTests(ITestOutputHelper output)
{
    [Fact]
    public async Task StartAsync_DefaultHost_AcceptsIPv4LoopbackOnlyRefusesIPv6LoopbackAndHostAddresses()
    {
        var options = new BrokerOptions { Port = FreePort.Next() };
        Assert.Equal("127.0.0.1", options.Host);
        await using var broker = await StartAsync(options);

        Assert.True(await PublishAsync("127.0.0.1", options.Port), "the configured address must accept");
        Assert.False(await PublishAsync("::1", options.Port), "::1 is not configured and must be refused");
        var others = NonLoopbackAddresses();
        output.WriteLine(others.Count == 0
            ? "This host has no non-loopback address; only ::1 was tried (nothing was created outside the sandbox)."
            : "Non-loopback addresses tried: " + string.Join(", ", others));
        foreach (var address in others)
        {
            Assert.False(await PublishAsync(address.ToString(), options.Port), address + " is not configured and must be refused");
        }
    }

    [Fact]
    public async Task StartAsync_IPv6Loopback_AcceptsIPv6LoopbackOnly()
    {
        var options = new BrokerOptions { Host = "::1", Port = FreePort.Next() };
        await using var broker = await StartAsync(options);

        Assert.True(await PublishAsync("::1", options.Port), "the configured address must accept");
        Assert.False(await PublishAsync("127.0.0.1", options.Port), "127.0.0.1 is not configured and must be refused");
        foreach (var address in NonLoopbackAddresses())
        {
            Assert.False(await PublishAsync(address.ToString(), options.Port), address + " is not configured and must be refused");
        }
    }

    [Fact]
    public async Task StartAsync_Localhost_AcceptsBothLoopbacksRefusesHostAddresses()
    {
        var options = new BrokerOptions { Host = "localhost", Port = FreePort.Next() };
        await using var broker = await StartAsync(options);

        Assert.True(await PublishAsync("127.0.0.1", options.Port));
        Assert.True(await PublishAsync("::1", options.Port));
        foreach (var address in NonLoopbackAddresses())
        {
            Assert.False(await PublishAsync(address.ToString(), options.Port), address + " is not configured and must be refused");
        }
    }

    [Theory]
    [InlineData("broker.example")]
    [InlineData("127.0.0.1:1883")]
    [InlineData("")]
    public void Parse_NotAnAddress_ThrowsNamingTheSetting(string host)
    {
        var error = Assert.Throws<ArgumentException>(() => BrokerBindAddresses.Parse(host));
        Assert.Contains("Broker:Host", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_IPv4Literal_OpensNoIPv6Listener()
    {
        var bind = BrokerBindAddresses.Parse("127.0.0.1");
        Assert.Equal(IPAddress.Loopback, bind.V4);
        Assert.Equal(IPAddress.None, bind.V6);
    }

    private static async Task<Started> StartAsync(BrokerOptions options)
    {
        var service = new EmbeddedBrokerService(Options.Create(options), NullLogger<EmbeddedBrokerService>.Instance);
        await service.StartAsync(CancellationToken.None);
        return new Started(service);
    }

    /// <summary>Addresses of this host's interfaces that are not loopback; IPv6 link-local ones need a scope and are left out.</summary>
    private static List<IPAddress> NonLoopbackAddresses()
    {
        var found = new List<IPAddress>();
        foreach (var nic in NetworkInterface.GetAllNetworkInterfaces())
        {
            if (nic.OperationalStatus != OperationalStatus.Up || nic.NetworkInterfaceType == NetworkInterfaceType.Loopback)
            {
                continue;
            }
            foreach (var unicast in nic.GetIPProperties().UnicastAddresses)
            {
                var a = unicast.Address;
                if (!IPAddress.IsLoopback(a) && !a.IsIPv6LinkLocal && a.AddressFamily is AddressFamily.InterNetwork or AddressFamily.InterNetworkV6)
                {
                    found.Add(a);
                }
            }
        }
        return found;
    }

    /// <summary>True when mosquitto_pub connected and had its QoS 1 message acknowledged.</summary>
    private async Task<bool> PublishAsync(string host, int port)
    {
        var psi = new ProcessStartInfo(MosquittoClients.Pub) { UseShellExecute = false, RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (string a in new[] { "-h", host, "-p", port.ToString(CultureInfo.InvariantCulture), "-q", "1", "-i", "bind-probe", "-t", "runwatch/lab/C1/telemetry", "-m", "{}" })
        {
            psi.ArgumentList.Add(a);
        }
        using var process = Process.Start(psi)!;
        string error = await process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();
        output.WriteLine("mosquitto_pub -h " + host + " -> exit " + process.ExitCode.ToString(CultureInfo.InvariantCulture) + " " + error.Trim());
        return process.ExitCode == 0;
    }

    private sealed class Started(EmbeddedBrokerService service) : IAsyncDisposable
    {
        public async ValueTask DisposeAsync()
        {
            await service.StopAsync(CancellationToken.None);
            service.Dispose();
        }
    }
}
