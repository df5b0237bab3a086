using System.Globalization;
using System.Text;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Mqtt;

/// <summary>The daemon's ingest against a real Mosquitto broker with independent and MQTTnet publishers.</summary>
public sealed class MosquittoIngestTests
{
    private static readonly DateTimeOffset Start = DateTimeOffset.UtcNow.AddMinutes(-1);

    [Fact]
    public async Task Ingest_MosquittoPubAndMqttNetPublishers_EverySampleStoredExactlyOnce()
    {
        await using var broker = await MosquittoBroker.StartAsync();
        await using var daemon = await InProcessDaemon.StartAsync(broker.Port);
        const int PerPublisher = 3000;

        // Independent client: Debian's mosquitto_pub, batched telemetry objects (seq 0..2999, two channels each).
        var lines = Enumerable.Range(0, PerPublisher).Select(i => TelemetryLine(i)).ToList();
        await MosquittoClients.PublishLinesAsync(broker.Port, "runwatch/lab/C1/telemetry", lines, "pub-independent");
        // Our own client: one value per topic with time and seq (seq 100000..).
        await using (var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "pub-mqttnet"))
        {
            int acked = await publisher.PublishManyAsync("runwatch/lab/C1/ch/substrate_sp", 100_000, PerPublisher, i => ChannelValue(i));
            Assert.Equal(PerPublisher, acked);
        }

        long expected = (2 * PerPublisher) + PerPublisher;
        long stored = await Poll.UntilReachedOrStalledAsync(() => daemon.Scalar("SELECT COUNT(*) FROM samples"), expected, TimeSpan.FromSeconds(10), TimeSpan.FromSeconds(60));

        Assert.Equal(expected, stored);
        Assert.Equal(PerPublisher, daemon.Scalar("SELECT COUNT(DISTINCT seq) FROM samples WHERE channel_id = (SELECT id FROM channels WHERE name = 'substrate_tc')"));
        Assert.Equal(PerPublisher, daemon.Scalar("SELECT COUNT(DISTINCT seq) FROM samples WHERE seq >= 100000"));
        Assert.Equal(0, daemon.Scalar("SELECT COUNT(*) FROM dead_letters"));
    }

    [Fact]
    public async Task Ingest_BadMessagesAmongGood_GoodStoredBadDeadLetteredDaemonKeepsRunning()
    {
        await using var broker = await MosquittoBroker.StartAsync();
        await using var daemon = await InProcessDaemon.StartAsync(broker.Port);

        var lines = new List<string>();
        for (int i = 0; i < 200; i++)
        {
            lines.Add(i % 4 == 1 ? "{\"t\":" : i % 4 == 3 ? "[1,2,\"x\"]" : TelemetryLine(i));
        }
        await MosquittoClients.PublishLinesAsync(broker.Port, "runwatch/lab/C1/telemetry", lines, "pub-mixed");

        long stored = await Poll.UntilReachedOrStalledAsync(() => daemon.Scalar("SELECT COUNT(*) FROM samples"), 200, TimeSpan.FromSeconds(5), TimeSpan.FromSeconds(30));
        await Poll.UntilAsync(() => daemon.Scalar("SELECT COUNT(*) FROM dead_letters") == 100, TimeSpan.FromSeconds(10), "dead letters");

        Assert.Equal(200, stored);
        Assert.Equal(50, daemon.Scalar("SELECT COUNT(*) FROM dead_letters WHERE reason = 'malformed_json'"));
        Assert.Equal(50, daemon.Scalar("SELECT COUNT(*) FROM dead_letters WHERE reason = 'wrong_type'"));
        Assert.Equal(Health.BrokerConnectionState.Connected, daemon.Health.Snapshot().BrokerState);
    }

    internal static string TelemetryLine(int seq) => string.Create(CultureInfo.InvariantCulture,
        $"{{\"t\":\"{Start.AddMilliseconds(seq * 10):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{seq},\"values\":{{\"substrate_tc\":{600 + (seq % 100) * 0.1:F1},\"ga_shutter\":{seq % 2}}}}}");

    internal static byte[] ChannelValue(int seq) => Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
        $"{{\"t\":\"{Start.AddMilliseconds((seq % 100_000) * 10):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{seq},\"v\":{610 + (seq % 7)}}}"));
}
