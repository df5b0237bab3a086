using System.Text.Json;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Mqtt;

namespace RunWatch.Ingest.Alerts;

/// <summary>Publishes alert changes as JSON on <c>{root}/{site}/{chamber}/alert</c>, daemon-wide ones on <c>{root}/daemon/{instance}/alert</c> (QoS 1, not retained).</summary>
internal sealed class MqttAlertSink(IMqttPublisher publisher, IOptions<IngestOptions> ingest, IOptions<BrokerOptions> broker) : IAlertSink
{
    public string Name => "mqtt";

    public async Task SendAsync(AlertNotification notification, CancellationToken cancellationToken)
    {
        string topic = notification.Alert.Chamber is { } chamber && notification.Site is { } site
            ? ingest.Value.TopicRoot + "/" + site + "/" + chamber + "/alert"
            : ingest.Value.TopicRoot + "/daemon/" + broker.Value.InstanceName + "/alert";
        byte[] payload = JsonSerializer.SerializeToUtf8Bytes(AlertJson.From(notification), AlertJsonContext.Default.AlertJson);
        if (!await publisher.TryPublishAsync(topic, payload, retain: false, cancellationToken).ConfigureAwait(false))
        {
            throw new InvalidOperationException("not connected to the broker; alert not published on " + topic);
        }
    }
}
