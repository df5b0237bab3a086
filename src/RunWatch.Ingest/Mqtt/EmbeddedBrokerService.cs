using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using MQTTnet.Protocol;
using MQTTnet.Server;
using RunWatch.Ingest.Configuration;

namespace RunWatch.Ingest.Mqtt;

/// <summary>
/// The embedded MQTTnet broker for a single box and the demo, bound to exactly <see cref="BrokerOptions.Host"/> and
/// no other address of either family (127.0.0.1 by default; see <see cref="BrokerBindAddresses"/>). Its sessions and queued messages live in memory only: what is queued for the daemon is lost if the
/// daemon process dies. Checks the configured user name and password when one is set.
/// </summary>
internal sealed class EmbeddedBrokerService(IOptions<BrokerOptions> options, ILogger<EmbeddedBrokerService> logger) : IHostedService, IDisposable
{
    private MqttServer? _server;

    public async Task StartAsync(CancellationToken cancellationToken)
    {
        var broker = options.Value;
        var bind = BrokerBindAddresses.Parse(broker.Host);
        var serverOptions = new MqttServerOptionsBuilder()
            .WithDefaultEndpoint()
            .WithDefaultEndpointBoundIPAddress(bind.V4)
            .WithDefaultEndpointBoundIPV6Address(bind.V6)
            .WithDefaultEndpointPort(broker.Port)
            .WithPersistentSessions(true)
            .WithMaxPendingMessagesPerClient(broker.EmbeddedMaxPendingMessagesPerClient)
            .Build();
        _server = new MqttServerFactory().CreateMqttServer(serverOptions);
        if (!string.IsNullOrEmpty(broker.Username))
        {
            string? password = broker.PasswordFile is { Length: > 0 } file ? File.ReadAllText(file).TrimEnd('\r', '\n') : broker.Password;
            _server.ValidatingConnectionAsync += e =>
            {
                if (e.UserName != broker.Username || e.Password != password)
                {
                    e.ReasonCode = MqttConnectReasonCode.BadUserNameOrPassword;
                }
                return Task.CompletedTask;
            };
        }
        // MQTTnet's server has no packet size limit of its own: refuse oversize publishes before they are queued for
        // anyone (the sender's packet has been read once; nothing keeps it).
        _server.InterceptingPublishAsync += e =>
        {
            if (e.ApplicationMessage.Payload.Length > broker.MaximumPacketBytes)
            {
                e.ProcessPublish = false;
            }
            return Task.CompletedTask;
        };
        await _server.StartAsync().ConfigureAwait(false);
        Log.EmbeddedStarted(logger, bind.ToString(), broker.Port);
    }

    public async Task StopAsync(CancellationToken cancellationToken)
    {
        if (_server is not null)
        {
            await _server.StopAsync(new MqttServerStopOptions()).ConfigureAwait(false);
        }
    }

    public void Dispose() => _server?.Dispose();
}
