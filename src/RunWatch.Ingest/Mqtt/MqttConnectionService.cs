using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using MQTTnet;
using MQTTnet.Protocol;
using Polly;
using Polly.Retry;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Pipeline;

namespace RunWatch.Ingest.Mqtt;

/// <summary>
/// Keeps the daemon's one MQTT connection: connects with a persistent session and a last will, subscribes at QoS 1,
/// reconnects with exponential backoff and jitter, publishes the retained online/offline status, hands every message
/// to the ingest queue with automatic acknowledgement off, and sends the acknowledgement when the committer asks.
/// </summary>
internal sealed class MqttConnectionService : BackgroundService, IMessageAcknowledger, IMqttPublisher
{
    private readonly BrokerOptions _broker;
    private readonly IngestOptions _ingest;
    private readonly bool _fleet;
    private readonly InboundQueue _queue;
    private readonly IngestHealth _health;
    private readonly IngestMetrics _metrics;
    private readonly TimeProvider _timeProvider;
    private readonly ILogger _logger;
    private readonly IMqttClient _client;
    private readonly CoalescingAdapterFactory _adapters = new();
    private readonly SemaphoreSlim _disconnected = new(0, 1);
    private readonly CancellationTokenSource _stopping = new();
    private long _generation;

    public MqttConnectionService(
        IOptions<BrokerOptions> broker,
        IOptions<IngestOptions> ingest,
        IOptions<FleetOptions> fleet,
        InboundQueue queue,
        IngestHealth health,
        IngestMetrics metrics,
        TimeProvider timeProvider,
        ILogger<MqttConnectionService> logger)
    {
        _broker = broker.Value;
        _ingest = ingest.Value;
        _fleet = fleet.Value.Enabled;
        _queue = queue;
        _health = health;
        _metrics = metrics;
        _timeProvider = timeProvider;
        _logger = logger;
        _client = new MqttClientFactory().CreateMqttClient(_adapters);
        _client.ApplicationMessageReceivedAsync += OnMessageAsync;
        _client.DisconnectedAsync += OnDisconnectedAsync;
        health.SetBroker(BrokerConnectionState.Disconnected, timeProvider.GetUtcNow(), null);
    }

    public string StatusTopic => MqttClientOptionsFactory.StatusTopic(_ingest, _broker);

    public async ValueTask<int> AcknowledgeAsync(ReadOnlyMemory<AcknowledgementTicket> tickets, CancellationToken cancellationToken)
    {
        // An ack on a connection that is gone throws inside MQTTnet (#1792); the broker redelivers such messages anyway.
        long generation = Interlocked.Read(ref _generation);
        var channel = _adapters.Current;
        if (!_client.IsConnected || channel is null)
        {
            return 0;
        }
        int sent = 0;
        await channel.HoldAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            for (int i = 0; i < tickets.Length; i++)
            {
                var ticket = tickets.Span[i];
                if (ticket.Generation != generation || ticket.Handle is not MqttApplicationMessageReceivedEventArgs args)
                {
                    continue;
                }
                await args.AcknowledgeAsync(cancellationToken).ConfigureAwait(false);
                sent++;
            }
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // Connection lost mid-batch: the acks kept so far still go out at release if the transport allows; the broker redelivers the rest.
        }
        try
        {
            await channel.ReleaseAsync(cancellationToken).ConfigureAwait(false);
            return sent;
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            return 0;
        }
    }

    public async Task<bool> TryPublishAsync(string topic, ReadOnlyMemory<byte> payload, bool retain, CancellationToken cancellationToken)
    {
        if (!_client.IsConnected)
        {
            return false;
        }
        try
        {
            var message = new MqttApplicationMessageBuilder()
                .WithTopic(topic)
                .WithPayloadSegment(payload)
                .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce)
                .WithRetainFlag(retain)
                .Build();
            var result = await _client.PublishAsync(message, cancellationToken).ConfigureAwait(false);
            return result.IsSuccess;
        }
        catch (Exception ex) when (ex is not OperationCanceledException and not OutOfMemoryException)
        {
            Log.PublishFailed(_logger, topic, ex.Message);
            return false;
        }
    }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        await _stopping.CancelAsync().ConfigureAwait(false);
        if (_client.IsConnected)
        {
            // A clean disconnect suppresses the last will, so say offline ourselves first.
            await TryPublishAsync(StatusTopic, "offline"u8.ToArray(), retain: true, cancellationToken).ConfigureAwait(false);
            try
            {
                await _client.DisconnectAsync(new MqttClientDisconnectOptionsBuilder().WithReason(MqttClientDisconnectOptionsReason.NormalDisconnection).Build(), cancellationToken).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is not OutOfMemoryException)
            {
                Log.Disconnected(_logger, ex.Message);
            }
        }
        await base.StopAsync(cancellationToken).ConfigureAwait(false);
    }

    public override void Dispose()
    {
        _client.Dispose();
        _disconnected.Dispose();
        _stopping.Dispose();
        base.Dispose();
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var options = MqttClientOptionsFactory.Build(_broker, _ingest);
        var reconnect = new ResiliencePipelineBuilder { TimeProvider = _timeProvider }
            .AddRetry(new RetryStrategyOptions
            {
                ShouldHandle = new PredicateBuilder().Handle<Exception>(ex => ex is not OperationCanceledException || !stoppingToken.IsCancellationRequested),
                BackoffType = DelayBackoffType.Exponential,
                UseJitter = true,
                Delay = _broker.ReconnectInitialDelay,
                MaxDelay = _broker.ReconnectMaxDelay,
                MaxRetryAttempts = int.MaxValue,
                OnRetry = args =>
                {
                    string error = args.Outcome.Exception?.Message ?? "unknown";
                    _health.SetBroker(BrokerConnectionState.Disconnected, _timeProvider.GetUtcNow(), error);
                    _metrics.BrokerConnected.Set(0);
                    Log.ConnectFailed(_logger, error, (long)args.RetryDelay.TotalMilliseconds);
                    return default;
                },
            })
            .Build();

        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                await reconnect.ExecuteAsync(async ct => await ConnectAndSubscribeAsync(options, ct).ConfigureAwait(false), stoppingToken).ConfigureAwait(false);
                await _disconnected.WaitAsync(stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                return;
            }
        }
    }

    private async Task ConnectAndSubscribeAsync(MqttClientOptions options, CancellationToken cancellationToken)
    {
        _health.SetBroker(BrokerConnectionState.Connecting, _timeProvider.GetUtcNow(), null);
        Log.Connecting(_logger, _broker.Host, _broker.Port, _broker.ClientId, _broker.UseTls, _broker.ProtocolVersion, options.SessionExpiryInterval);
        if (_client.IsConnected)
        {
            await _client.DisconnectAsync(new MqttClientDisconnectOptions(), cancellationToken).ConfigureAwait(false);
        }
        // Messages of the previous connection must not be acknowledged on this one.
        Interlocked.Increment(ref _generation);
        var result = await _client.ConnectAsync(options, cancellationToken).ConfigureAwait(false);
        if (result.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new MqttConnectRefusedException("broker refused the connection: " + result.ResultCode.ToString() + (result.ReasonString is { Length: > 0 } r ? " (" + r + ")" : ""));
        }
        Log.Connected(_logger, result.IsSessionPresent, result.ReceiveMaximum ?? 0);

        if (_fleet)
        {
            // Fleet mode: chamber topics belong to the chamber sessions of whichever daemon owns each chamber; this
            // connection only publishes the daemon's status and alerts.
            await TryPublishAsync(StatusTopic, "online"u8.ToArray(), retain: true, cancellationToken).ConfigureAwait(false);
            _health.SetBroker(BrokerConnectionState.Connected, _timeProvider.GetUtcNow(), null);
            _metrics.BrokerConnected.Set(1);
            return;
        }
        var subscribe = new MqttClientSubscribeOptionsBuilder();
        string root = _ingest.TopicRoot;
        foreach (string filter in new[] { root + "/+/+/telemetry", root + "/+/+/ch/+", root + "/+/+/event" })
        {
            subscribe.WithTopicFilter(f => f.WithTopic(filter).WithAtLeastOnceQoS().WithRetainHandling(MqttRetainHandling.SendAtSubscribeIfNewSubscriptionOnly));
        }
        var subscribed = await _client.SubscribeAsync(subscribe.Build(), cancellationToken).ConfigureAwait(false);
        foreach (var item in subscribed.Items)
        {
            if (item.ResultCode is not (MqttClientSubscribeResultCode.GrantedQoS1 or MqttClientSubscribeResultCode.GrantedQoS2))
            {
                Log.SubscribeRefused(_logger, item.TopicFilter.Topic, item.ResultCode.ToString());
            }
        }
        await TryPublishAsync(StatusTopic, "online"u8.ToArray(), retain: true, cancellationToken).ConfigureAwait(false);
        _health.SetBroker(BrokerConnectionState.Connected, _timeProvider.GetUtcNow(), null);
        _metrics.BrokerConnected.Set(1);
    }

    private Task OnMessageAsync(MqttApplicationMessageReceivedEventArgs e)
    {
        var message = e.ApplicationMessage;
        bool needsAck = message.QualityOfServiceLevel != MqttQualityOfServiceLevel.AtMostOnce;
        e.AutoAcknowledge = !needsAck;
        var pending = _queue.EnqueueAsync(message.Topic, message.Payload, needsAck ? e : null, Interlocked.Read(ref _generation), _stopping.Token);
        return pending.IsCompletedSuccessfully ? Task.CompletedTask : pending.AsTask();
    }

    private Task OnDisconnectedAsync(MqttClientDisconnectedEventArgs e)
    {
        if (!e.ClientWasConnected)
        {
            return Task.CompletedTask;
        }
        _health.SetBroker(BrokerConnectionState.Disconnected, _timeProvider.GetUtcNow(), e.Reason.ToString());
        _metrics.BrokerConnected.Set(0);
        if (!_stopping.IsCancellationRequested)
        {
            Log.Disconnected(_logger, e.Reason.ToString() + (e.Exception is { } ex ? ": " + ex.Message : ""));
        }
        if (_disconnected.CurrentCount == 0)
        {
            try
            {
                _disconnected.Release();
            }
            catch (SemaphoreFullException)
            {
                // Already signalled.
            }
        }
        return Task.CompletedTask;
    }
}
