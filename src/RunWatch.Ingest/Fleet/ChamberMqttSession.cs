using Microsoft.Extensions.Logging;
using MQTTnet;
using MQTTnet.Protocol;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Mqtt;
using RunWatch.Ingest.Pipeline;

namespace RunWatch.Ingest.Fleet;

/// <summary>
/// The MQTT session of one owned chamber: its own client whose id belongs to the chamber, not to the daemon
/// (<see cref="FleetOptions.ChamberClientId"/>), with a persistent session (clean start off, session expiry set), so
/// the broker keeps queueing the chamber's QoS 1 messages while ownership moves and the next owner resumes the same
/// session and gets every unacknowledged message again. Subscribes to the chamber's own topics only; messages go to
/// the shared ingest queue and are acknowledged after commit, in order, in one socket write per batch.
/// </summary>
internal sealed class ChamberMqttSession : IAsyncDisposable
{
    private static long _nextGeneration = 1L << 40;

    private readonly BrokerOptions _broker;
    private readonly IngestOptions _ingest;
    private readonly InboundQueue _queue;
    private readonly ILogger _logger;
    private readonly CoalescingAdapterFactory _adapters = new();
    private readonly IMqttClient _client;
    private readonly CancellationTokenSource _stopping = new();
    private readonly SemaphoreSlim _disconnected = new(0, 1);
    private Task? _loop;
    private long _generation;

    public ChamberMqttSession(ChamberRuntime chamber, string clientId, BrokerOptions broker, IngestOptions ingest, InboundQueue queue, ILogger logger)
    {
        Chamber = chamber;
        ClientId = clientId;
        _broker = broker;
        _ingest = ingest;
        _queue = queue;
        _logger = logger;
        _client = new MqttClientFactory().CreateMqttClient(_adapters);
        _client.ApplicationMessageReceivedAsync += OnMessageAsync;
        _client.DisconnectedAsync += OnDisconnectedAsync;
    }

    public ChamberRuntime Chamber { get; }

    public string ClientId { get; }

    /// <summary>Generation of the current connection: unique across every session of the process.</summary>
    public long Generation => Interlocked.Read(ref _generation);

    /// <summary>Raised with the new generation after each (re)connection, so the acknowledger can route acks.</summary>
    public event Action<ChamberMqttSession, long>? Connected;

    /// <summary>Connects and subscribes once (so the caller knows when the chamber is live), then keeps reconnecting in the background.</summary>
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        await ConnectAndSubscribeAsync(cancellationToken).ConfigureAwait(false);
        _loop = KeepConnectedAsync(_stopping.Token);
    }

    /// <summary>Acknowledges, in order, the tickets of this session's current connection; returns how many were sent.</summary>
    public async ValueTask<int> AcknowledgeAsync(ReadOnlyMemory<AcknowledgementTicket> tickets, long generation, CancellationToken cancellationToken)
    {
        var channel = _adapters.Current;
        if (!_client.IsConnected || channel is null || generation != Generation)
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
                if (ticket.Generation == generation && ticket.Handle is MqttApplicationMessageReceivedEventArgs args)
                {
                    await args.AcknowledgeAsync(cancellationToken).ConfigureAwait(false);
                    sent++;
                }
            }
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // Connection lost mid-batch (MQTTnet#1792): the broker redelivers what was not acknowledged.
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

    /// <summary>
    /// Leaves the broker without ending the session: the broker keeps it (and queues for it) for the next owner.
    /// Messages received but not yet acknowledged are redelivered to that owner.
    /// </summary>
    public async ValueTask DisposeAsync()
    {
        await _stopping.CancelAsync().ConfigureAwait(false);
        try
        {
            if (_client.IsConnected)
            {
                await _client.DisconnectAsync(new MqttClientDisconnectOptionsBuilder().WithReason(MqttClientDisconnectOptionsReason.NormalDisconnection).Build()).ConfigureAwait(false);
            }
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            FleetLog.ChamberSessionError(_logger, Chamber.Name, ex.Message);
        }
        if (_loop is not null)
        {
            await _loop.ConfigureAwait(false);
        }
        _client.Dispose();
        _stopping.Dispose();
        _disconnected.Dispose();
    }

    private async Task KeepConnectedAsync(CancellationToken stoppingToken)
    {
        var delay = _broker.ReconnectInitialDelay;
        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                await _disconnected.WaitAsync(stoppingToken).ConfigureAwait(false);
                while (!stoppingToken.IsCancellationRequested && !_client.IsConnected)
                {
                    try
                    {
                        await Task.Delay(delay, stoppingToken).ConfigureAwait(false);
                        await ConnectAndSubscribeAsync(stoppingToken).ConfigureAwait(false);
                        delay = _broker.ReconnectInitialDelay;
                    }
                    catch (Exception ex) when (ex is not OperationCanceledException)
                    {
                        FleetLog.ChamberSessionError(_logger, Chamber.Name, ex.Message);
                        delay = TimeSpan.FromTicks(Math.Min(_broker.ReconnectMaxDelay.Ticks, delay.Ticks * 2));
                    }
                }
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                return;
            }
        }
    }

    private async Task ConnectAndSubscribeAsync(CancellationToken cancellationToken)
    {
        var options = MqttClientOptionsFactory.Build(_broker, _ingest);
        options.ClientId = ClientId;
        // The daemon's own connection carries the daemon's last will; a chamber session has none.
        options.WillTopic = null;
        options.WillPayload = null;
        long generation = Interlocked.Increment(ref _nextGeneration);
        Interlocked.Exchange(ref _generation, generation);
        var result = await _client.ConnectAsync(options, cancellationToken).ConfigureAwait(false);
        if (result.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new MqttConnectRefusedException("broker refused the chamber session " + ClientId + ": " + result.ResultCode.ToString());
        }
        string prefix = _ingest.TopicRoot + "/" + Chamber.Site + "/" + Chamber.Name;
        var subscribe = new MqttClientSubscribeOptionsBuilder();
        foreach (string filter in new[] { prefix + "/telemetry", prefix + "/ch/+", prefix + "/event" })
        {
            subscribe.WithTopicFilter(f => f.WithTopic(filter).WithAtLeastOnceQoS().WithRetainHandling(MqttRetainHandling.SendAtSubscribeIfNewSubscriptionOnly));
        }
        await _client.SubscribeAsync(subscribe.Build(), cancellationToken).ConfigureAwait(false);
        FleetLog.ChamberSessionConnected(_logger, Chamber.Name, ClientId, result.IsSessionPresent);
        Connected?.Invoke(this, generation);
    }

    private Task OnMessageAsync(MqttApplicationMessageReceivedEventArgs e)
    {
        var message = e.ApplicationMessage;
        bool needsAck = message.QualityOfServiceLevel != MqttQualityOfServiceLevel.AtMostOnce;
        e.AutoAcknowledge = !needsAck;
        var pending = _queue.EnqueueAsync(message.Topic, message.Payload, needsAck ? e : null, Generation, _stopping.Token);
        return pending.IsCompletedSuccessfully ? Task.CompletedTask : pending.AsTask();
    }

    private Task OnDisconnectedAsync(MqttClientDisconnectedEventArgs e)
    {
        if (e.ClientWasConnected && !_stopping.IsCancellationRequested)
        {
            FleetLog.ChamberSessionError(_logger, Chamber.Name, "disconnected: " + e.Reason.ToString());
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
