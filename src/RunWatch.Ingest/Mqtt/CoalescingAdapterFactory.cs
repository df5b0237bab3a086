using MQTTnet;
using MQTTnet.Adapter;
using MQTTnet.Diagnostics.Logger;
using MQTTnet.Diagnostics.PacketInspection;
using MQTTnet.Formatter;
using MQTTnet.Implementations;

namespace RunWatch.Ingest.Mqtt;

/// <summary>
/// Builds each connection's adapter the way MQTTnet's own factory does for TCP (TLS included, inside
/// <see cref="MqttTcpChannel"/>), with the transport wrapped in a <see cref="CoalescingChannel"/>, and remembers the
/// channel of the newest connection for the acknowledger.
/// </summary>
internal sealed class CoalescingAdapterFactory : IMqttClientAdapterFactory
{
    private CoalescingChannel? _current;

    /// <summary>The channel of the most recent connection, or null before the first.</summary>
    public CoalescingChannel? Current => Volatile.Read(ref _current);

    public IMqttChannelAdapter CreateClientAdapter(MqttClientOptions options, MqttPacketInspector packetInspector, IMqttNetLogger logger)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (options.ChannelOptions is not MqttClientTcpOptions)
        {
            throw new NotSupportedException("RunWatch connects to its broker over TCP (with or without TLS).");
        }
        var channel = new CoalescingChannel(new MqttTcpChannel(options));
        var formatter = new MqttPacketFormatterAdapter(options.ProtocolVersion, new MqttBufferWriter(options.WriterBufferSize, options.WriterBufferSizeMax));
        var adapter = new MqttChannelAdapter(channel, formatter, logger)
        {
            AllowPacketFragmentation = options.AllowPacketFragmentation,
            PacketInspector = packetInspector,
        };
        Volatile.Write(ref _current, channel);
        return adapter;
    }
}
