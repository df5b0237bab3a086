using MQTTnet;
using MQTTnet.Protocol;

namespace RunWatch.Testing.Mqtt;

/// <summary>An MQTTnet QoS 1 publisher for tests and benchmarks, with a bounded number of publishes in flight.</summary>
public sealed class MqttTestPublisher : IAsyncDisposable
{
    private readonly IMqttClient _client;

    private MqttTestPublisher(IMqttClient client) => _client = client;

    public static async Task<MqttTestPublisher> ConnectAsync(int port, string clientId, CancellationToken cancellationToken = default)
    {
        var client = new MqttClientFactory().CreateMqttClient();
        var options = new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", port).WithClientId(clientId).WithCleanStart(true).Build();
        var result = await client.ConnectAsync(options, cancellationToken).ConfigureAwait(false);
        if (result.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new InvalidOperationException("publisher could not connect: " + result.ResultCode);
        }
        return new MqttTestPublisher(client);
    }

    /// <summary>
    /// Publishes <paramref name="count"/> messages at QoS 1, <paramref name="payload"/>(i) for i = first…first+count−1,
    /// keeping at most <paramref name="maxInFlight"/> unacknowledged. Returns how many the broker acknowledged.
    /// </summary>
    public async Task<int> PublishManyAsync(string topic, int first, int count, Func<int, byte[]> payload, int maxInFlight = 100, CancellationToken cancellationToken = default)
    {
        using var window = new SemaphoreSlim(maxInFlight);
        int acknowledged = 0;
        var pending = new List<Task>(count);
        for (int i = first; i < first + count; i++)
        {
            await window.WaitAsync(cancellationToken).ConfigureAwait(false);
            var message = new MqttApplicationMessageBuilder().WithTopic(topic).WithPayload(payload(i))
                .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce).Build();
            pending.Add(PublishOneAsync(message));
        }
        await Task.WhenAll(pending).ConfigureAwait(false);
        return acknowledged;

        async Task PublishOneAsync(MqttApplicationMessage message)
        {
            try
            {
                var result = await _client.PublishAsync(message, cancellationToken).ConfigureAwait(false);
                if (result.IsSuccess)
                {
                    Interlocked.Increment(ref acknowledged);
                }
            }
            finally
            {
                window.Release();
            }
        }
    }

    public async Task PublishAsync(string topic, byte[] payload, CancellationToken cancellationToken = default)
    {
        var message = new MqttApplicationMessageBuilder().WithTopic(topic).WithPayload(payload).WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce).Build();
        var result = await _client.PublishAsync(message, cancellationToken).ConfigureAwait(false);
        if (!result.IsSuccess)
        {
            throw new InvalidOperationException("publish refused: " + result.ReasonCode);
        }
    }

    public async ValueTask DisposeAsync()
    {
        if (_client.IsConnected)
        {
            await _client.DisconnectAsync(new MqttClientDisconnectOptions()).ConfigureAwait(false);
        }
        _client.Dispose();
    }
}
