using System.Globalization;
using System.Text;
using MQTTnet;
using MQTTnet.Protocol;

namespace RunWatch.Tests.Demo;

/// <summary>
/// A setpoint ramp and a hold excursion played into the demo's chamber over MQTT, once, after the demo's own runs:
/// the demo's runs only ramp and grow under PID control, so this gives the state-based alarm rule one case of each.
/// </summary>
public sealed partial class DemoFixture
{
    private readonly SemaphoreSlim _excursionGate = new(1, 1);
    private DateTimeOffset? _excursionStart;

    /// <summary>
    /// Publishes (once) to the demo chamber, 10 samples a second from now: hold at 300 °C; the setpoint steps to
    /// 400 °C and the substrate follows as a first-order lag (τ = 1 s), a ramp; a hold at 400 °C; 30 K above it for
    /// 2 s, a hold excursion; back at 400 °C. Returns when the first sample is due.
    /// </summary>
    public async Task<DateTimeOffset> PlayRampAndHoldExcursionAsync()
    {
        await WaitAllReportedAsync();
        await _excursionGate.WaitAsync();
        try
        {
            if (_excursionStart is { } done)
            {
                return done;
            }
            var start = DateTimeOffset.UtcNow.AddMilliseconds(200);
            var json = new StringBuilder("[");
            for (int i = 0; i <= 120; i++)
            {
                double t = i / 10.0;
                double setpoint = t < 1 ? 300 : 400;
                double reading = t < 1 ? 300
                    : t < 6 ? 400 - (100 * Math.Exp(-(t - 1) / 1.0))
                    : t is >= 8 and < 10 ? 430
                    : 400;
                json.Append(i == 0 ? "" : ",").Append(string.Create(CultureInfo.InvariantCulture,
                    $$$"""{"t":"{{{start.AddSeconds(t).UtcDateTime:yyyy-MM-ddTHH:mm:ss.fffZ}}}","values":{"substrate_sp":{{{setpoint:F1}}},"substrate_tc":{{{reading:F2}}}}}"""));
            }
            json.Append(']');
            using var client = new MqttClientFactory().CreateMqttClient();
            await client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", BrokerPort).WithClientId("e2e-ramp-and-hold").Build());
            var result = await client.PublishAsync(new MqttApplicationMessageBuilder()
                .WithTopic("runwatch/lab/demo-1/telemetry").WithPayload(json.ToString()).WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce).Build());
            await client.DisconnectAsync();
            if (!result.IsSuccess)
            {
                throw new InvalidOperationException("publishing the ramp and hold excursion failed: " + result.ReasonString);
            }
            _excursionStart = start;
            return start;
        }
        finally
        {
            _excursionGate.Release();
        }
    }
}
