using Microsoft.Extensions.DependencyInjection;
using System.Collections.Concurrent;
using System.Globalization;
using System.Text;
using System.Text.Json;
using MQTTnet;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Mqtt;

/// <summary>Through a real broker: a run with an excursion gives an alert on the alert topic, a stored alert and a closed, evaluated run.</summary>
public sealed class AlertsEndToEndTests
{
    [Fact]
    public async Task Ingest_RunWithExcursion_AlertPublishedAndStoredRunEvaluated()
    {
        await using var broker = await MosquittoBroker.StartAsync();
        await using var daemon = await InProcessDaemon.StartAsync(broker.Port);
        var alerts = new ConcurrentQueue<string>();
        using var watcher = new MqttClientFactory().CreateMqttClient();
        watcher.ApplicationMessageReceivedAsync += e =>
        {
            alerts.Enqueue(Encoding.UTF8.GetString(e.ApplicationMessage.Payload));
            return Task.CompletedTask;
        };
        await watcher.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", broker.Port).WithClientId("alert-watcher").Build());
        await watcher.SubscribeAsync(new MqttClientSubscribeOptionsBuilder().WithTopicFilter("runwatch/lab/C1/alert", MQTTnet.Protocol.MqttQualityOfServiceLevel.AtLeastOnce).Build());

        var start = DateTimeOffset.UtcNow.AddMinutes(-5);
        await using (var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "e2e-publisher"))
        {
            await publisher.PublishAsync("runwatch/lab/C1/event", Json($"{{\"t\":\"{Iso(start)}\",\"type\":\"run-start\",\"run\":\"R-e2e\",\"setpoint_c\":600,\"planned_s\":120}}"));
            for (int s = 0; s <= 120; s++)
            {
                // 25 K above the setpoint from 40 s to 70 s.
                double value = s is >= 40 and < 70 ? 625 : 600;
                await publisher.PublishAsync("runwatch/lab/C1/telemetry", Json(string.Create(CultureInfo.InvariantCulture,
                    $"{{\"t\":\"{Iso(start.AddSeconds(s))}\",\"seq\":{s},\"values\":{{\"substrate_tc\":{value},\"substrate_sp\":600}}}}")));
            }
            await publisher.PublishAsync("runwatch/lab/C1/event", Json($"{{\"t\":\"{Iso(start.AddSeconds(120))}\",\"type\":\"run-end\",\"run\":\"R-e2e\"}}"));
        }

        await Poll.UntilAsync(() => daemon.Scalar("SELECT COUNT(*) FROM runs WHERE status = 'closed' AND l_eff_nm IS NOT NULL") == 1, TimeSpan.FromSeconds(20), "run closed and evaluated");
        await Poll.UntilAsync(() => alerts.Any(a => a.Contains("\"deviation-alarm\"", StringComparison.Ordinal)), TimeSpan.FromSeconds(10), "alert on the alert topic");

        using var raised = JsonDocument.Parse(alerts.First(a => a.Contains("\"deviation-alarm\"", StringComparison.Ordinal)));
        Assert.Equal("raised", raised.RootElement.GetProperty("change").GetString());
        Assert.Equal("C1", raised.RootElement.GetProperty("chamber").GetString());
        Assert.True(daemon.Scalar("SELECT COUNT(*) FROM alerts WHERE kind = 'deviation-alarm'") >= 1);
        // Raised during the run: the stored alert names it (at once, or within a tick when the run was saved after it).
        await Poll.UntilAsync(() => daemon.Scalar("SELECT COUNT(*) FROM alerts WHERE kind = 'deviation-alarm' AND (run_id IS NULL OR run_id <> (SELECT id FROM runs WHERE name = 'R-e2e'))") == 0,
            TimeSpan.FromSeconds(10), "alert linked to its run");
        Assert.Equal(1, daemon.Scalar("SELECT COUNT(*) FROM runs WHERE name = 'R-e2e' AND end_reason = 'EndEvent' AND excursions_json LIKE '%Alarm%'"));
        Assert.Equal(2, daemon.Scalar("SELECT COUNT(*) FROM events"));

        // One audit entry per acknowledgement: acknowledging the same alert again changes nothing and logs nothing.
        long alertId = daemon.Scalar("SELECT MIN(id) FROM alerts WHERE kind = 'deviation-alarm'");
        var commands = daemon.Services.GetRequiredService<RunWatch.Storage.IAlertCommands>();
        bool first = await commands.AcknowledgeAsync(alertId, "ada-engineer", "seen, furnace door closed", CancellationToken.None);
        bool second = await commands.AcknowledgeAsync(alertId, "ada-engineer", "seen again", CancellationToken.None);
        Assert.True(first);
        Assert.False(second);
        Assert.Equal(1, daemon.Scalar($"SELECT COUNT(*) FROM audit_entries WHERE action = 'alert-acknowledged' AND subject = '{alertId}'"));
        Assert.Equal(1, daemon.Scalar("SELECT COUNT(*) FROM audit_entries WHERE action LIKE '%acknowledg%'"));
    }

    private static byte[] Json(string text) => Encoding.UTF8.GetBytes(text);

    private static string Iso(DateTimeOffset t) => t.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", CultureInfo.InvariantCulture);
}
