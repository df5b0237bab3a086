using System.Buffers;
using System.Net;
using System.Security.Cryptography.X509Certificates;
using MQTTnet.Channel;
using RunWatch.Ingest.Mqtt;

namespace RunWatch.Ingest.Tests.Mqtt;

public sealed class CoalescingChannelTests
{
    [Fact]
    public async Task WriteAsync_NotHolding_PassesEachPacketStraightThrough()
    {
        var transport = new RecordingTransport();
        using var channel = new CoalescingChannel(transport);

        await channel.WriteAsync(Packet(1), isEndOfPacket: true, CancellationToken.None);
        await channel.WriteAsync(Packet(2), isEndOfPacket: true, CancellationToken.None);

        Assert.Equal([[0x40, 0x02, 0x00, 1], [0x40, 0x02, 0x00, 2]], transport.Writes);
    }

    [Fact]
    public async Task ReleaseAsync_AfterHeldPackets_SendsThemInOrderInOneWrite()
    {
        var transport = new RecordingTransport();
        using var channel = new CoalescingChannel(transport);

        await channel.HoldAsync(CancellationToken.None);
        var buffer = new byte[4];
        for (byte id = 1; id <= 3; id++)
        {
            // One buffer reused between packets, as the packet formatter does: the channel must have copied.
            Packet(id).CopyTo(buffer);
            await channel.WriteAsync(new ReadOnlySequence<byte>(buffer), isEndOfPacket: true, CancellationToken.None);
        }
        Assert.Empty(transport.Writes);
        await channel.ReleaseAsync(CancellationToken.None);
        await channel.WriteAsync(Packet(9), isEndOfPacket: true, CancellationToken.None);

        Assert.Equal([[0x40, 0x02, 0x00, 1, 0x40, 0x02, 0x00, 2, 0x40, 0x02, 0x00, 3], [0x40, 0x02, 0x00, 9]], transport.Writes);
        Assert.Equal(1, channel.CoalescedWrites);
    }

    [Fact]
    public async Task ReleaseAsync_TransportFails_ThrowsAndTheNextHoldStartsEmpty()
    {
        var transport = new RecordingTransport { FailNext = true };
        using var channel = new CoalescingChannel(transport);
        await channel.HoldAsync(CancellationToken.None);
        await channel.WriteAsync(Packet(1), isEndOfPacket: true, CancellationToken.None);

        await Assert.ThrowsAsync<IOException>(() => channel.ReleaseAsync(CancellationToken.None));

        await channel.HoldAsync(CancellationToken.None);
        await channel.WriteAsync(Packet(2), isEndOfPacket: true, CancellationToken.None);
        await channel.ReleaseAsync(CancellationToken.None);
        Assert.Equal([[0x40, 0x02, 0x00, 2]], transport.Writes);
    }

    [Fact]
    public async Task ReleaseAsync_NothingHeld_WritesNothing()
    {
        var transport = new RecordingTransport();
        using var channel = new CoalescingChannel(transport);

        await channel.HoldAsync(CancellationToken.None);
        await channel.ReleaseAsync(CancellationToken.None);

        Assert.Empty(transport.Writes);
        Assert.Equal(0, channel.CoalescedWrites);
    }

    /// <summary>An MQTT 3.1.1 PUBACK (type 4, remaining length 2, packet identifier), as in the OASIS MQTT 3.1.1 standard, section 3.4.</summary>
    private static ReadOnlySequence<byte> Packet(byte id) => new(new byte[] { 0x40, 0x02, 0x00, id });

    private sealed class RecordingTransport : IMqttChannel
    {
        public List<byte[]> Writes { get; } = [];

        public bool FailNext { get; set; }

        public X509Certificate2 ClientCertificate => null!;

        public EndPoint RemoteEndPoint => new IPEndPoint(IPAddress.Loopback, 1883);

        public EndPoint LocalEndPoint => new IPEndPoint(IPAddress.Loopback, 50000);

        public bool IsSecureConnection => false;

        public Task ConnectAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task DisconnectAsync(CancellationToken cancellationToken) => Task.CompletedTask;

        public Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) => Task.FromResult(0);

        public Task WriteAsync(ReadOnlySequence<byte> buffer, bool isEndOfPacket, CancellationToken cancellationToken)
        {
            if (FailNext)
            {
                FailNext = false;
                throw new IOException("connection reset by peer");
            }
            Writes.Add(buffer.ToArray());
            return Task.CompletedTask;
        }

        public void Dispose()
        {
        }
    }
}
