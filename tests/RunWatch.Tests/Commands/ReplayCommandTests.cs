using System.Collections.Concurrent;
using System.Globalization;
using System.Text;
using System.Text.Json;
using MQTTnet;
using RunWatch.Testing.Mqtt;
using Xunit;

namespace RunWatch.Tests.Commands;

public sealed class ReplayCommandTests
{
    [Fact]
    public async Task Replay_CsvWithRun_PublishesOneTelemetryMessagePerRowBetweenRunEvents()
    {
        await using var broker = await MosquittoBroker.StartAsync();
        var received = new ConcurrentQueue<(string Topic, string Payload)>();
        using var subscriber = new MqttClientFactory().CreateMqttClient();
        subscriber.ApplicationMessageReceivedAsync += e =>
        {
            received.Enqueue((e.ApplicationMessage.Topic, Encoding.UTF8.GetString(e.ApplicationMessage.Payload)));
            return Task.CompletedTask;
        };
        await subscriber.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", broker.Port).WithClientId("replay-test-sub").Build());
        await subscriber.SubscribeAsync(new MqttClientSubscribeOptionsBuilder().WithTopicFilter("runwatch/lab/C1/#", MQTTnet.Protocol.MqttQualityOfServiceLevel.AtLeastOnce).Build());
        using var csv = new TempFile("""
            # invented test log
            time,substrate_tc,ga_shutter
            0,600.5,0
            1.5,601.25,
            3,,1
            """);

        var run = CommandRun.Invoke("replay", csv.Path, "--speed", "0", "--port", broker.Port.ToString(CultureInfo.InvariantCulture), "--chamber", "C1", "--run", "R-test");

        Assert.Equal(0, run.ExitCode);
        Assert.Contains("published 3 telemetry messages", run.Output, StringComparison.Ordinal);
        var deadline = DateTime.UtcNow.AddSeconds(10);
        while (received.Count < 5 && DateTime.UtcNow < deadline)
        {
            await Task.Delay(20);
        }
        var messages = received.ToArray();
        Assert.Equal(5, messages.Length);
        Assert.Equal("runwatch/lab/C1/event", messages[0].Topic);
        Assert.Contains("\"run-start\"", messages[0].Payload, StringComparison.Ordinal);
        Assert.Contains("\"run-end\"", messages[4].Payload, StringComparison.Ordinal);
        var rows = messages[1..4].Select(m => JsonDocument.Parse(m.Payload).RootElement).ToArray();
        Assert.Equal(600.5, rows[0].GetProperty("values").GetProperty("substrate_tc").GetDouble());
        Assert.Equal(0, rows[0].GetProperty("values").GetProperty("ga_shutter").GetDouble());
        Assert.False(rows[1].GetProperty("values").TryGetProperty("ga_shutter", out _));
        Assert.False(rows[2].GetProperty("values").TryGetProperty("substrate_tc", out _));
        var t0 = rows[0].GetProperty("t").GetDateTimeOffset();
        Assert.Equal(1.5, (rows[1].GetProperty("t").GetDateTimeOffset() - t0).TotalSeconds, 1e-6);
        Assert.Equal(2, rows[2].GetProperty("seq").GetInt64());
    }

    [Fact]
    public async Task Replay_CaFileOfTheBrokersCa_PublishesOverTls_WithoutIt_Refused()
    {
        // Mosquitto with a plain listener for the test's subscriber and a TLS listener whose certificate a throw-away
        // CA signed (made by openssl), as in deploy/README.md; the system trust store does not know that CA.
        int tlsPort = FreePort.Next();
        await using var broker = await MosquittoBroker.StartWithConfigAsync((port, folder) =>
        {
            TestCertificates.Create(folder);
            return string.Join('\n',
                // As root Mosquitto would drop to its own user and could not read the key in the caller's temp folder.
                "user root",
                "per_listener_settings false",
                "allow_anonymous true",
                string.Create(CultureInfo.InvariantCulture, $"listener {port} 127.0.0.1"),
                string.Create(CultureInfo.InvariantCulture, $"listener {tlsPort} 127.0.0.1"),
                "cafile " + Path.Combine(folder, "ca.crt"),
                "certfile " + Path.Combine(folder, "broker.crt"),
                "keyfile " + Path.Combine(folder, "broker.key"),
                "persistence false",
                "");
        });
        var received = new ConcurrentQueue<string>();
        using var subscriber = new MqttClientFactory().CreateMqttClient();
        subscriber.ApplicationMessageReceivedAsync += e =>
        {
            received.Enqueue(e.ApplicationMessage.Topic);
            return Task.CompletedTask;
        };
        await subscriber.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", broker.Port).WithClientId("replay-tls-sub").Build());
        await subscriber.SubscribeAsync(new MqttClientSubscribeOptionsBuilder().WithTopicFilter("runwatch/lab/C1/#", MQTTnet.Protocol.MqttQualityOfServiceLevel.AtLeastOnce).Build());
        using var csv = new TempFile("""
            time,substrate_tc
            0,600.5
            1,601.0
            """);
        string port = tlsPort.ToString(CultureInfo.InvariantCulture);

        var untrusted = CommandRun.Invoke("replay", csv.Path, "--speed", "0", "--port", port, "--chamber", "C1", "--tls");
        var trusted = CommandRun.Invoke("replay", csv.Path, "--speed", "0", "--port", port, "--chamber", "C1",
            "--ca-file", Path.Combine(broker.Folder, "ca.crt"));

        Assert.NotEqual(0, untrusted.ExitCode);
        Assert.Equal(0, trusted.ExitCode);
        Assert.Contains("published 2 telemetry messages", trusted.Output, StringComparison.Ordinal);
        var deadline = DateTime.UtcNow.AddSeconds(10);
        while (received.Count < 2 && DateTime.UtcNow < deadline)
        {
            await Task.Delay(20);
        }
        Assert.Equal(2, received.Count);
    }

    [Fact]
    public void Replay_MissingFile_ExitsOneWithMessage()
    {
        var run = CommandRun.Invoke("replay", Path.Combine(Path.GetTempPath(), "no-such-runwatch-log.csv"), "--speed", "0", "--port", "1");

        Assert.Equal(1, run.ExitCode);
        Assert.Contains("no-such-runwatch-log.csv", run.Error, StringComparison.Ordinal);
    }
}
