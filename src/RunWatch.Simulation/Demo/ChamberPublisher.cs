using System.Globalization;
using System.Text;
using MQTTnet;
using MQTTnet.Protocol;
using RunWatch.Simulation.Chamber;

namespace RunWatch.Simulation.Demo;

/// <summary>
/// Publishes a simulated run to a broker exactly as a chamber gateway would (the project's message contract):
/// a run-start event, batched telemetry at QoS 1, step events, a run-end event. Simulated time runs
/// <see cref="ChamberSimulatorOptions.Acceleration"/> times faster than the wall clock, and samples carry wall-clock
/// timestamps, so the recorded growth window is the simulated one compressed by that factor (invented demo data).
/// </summary>
public sealed class ChamberPublisher(string host, int port, string topicRoot, string site, string chamber)
{
    private string Topic(string leaf) => $"{topicRoot}/{site}/{chamber}/{leaf}";

    /// <summary>Runs one simulated recipe and publishes it; returns the number of samples sent.</summary>
    public async Task<int> PublishRunAsync(DemoRunPlan plan, ChamberSimulatorOptions simulation, TimeProvider time, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(simulation);
        using var client = new MqttClientFactory().CreateMqttClient();
        var options = new MqttClientOptionsBuilder()
            .WithTcpServer(host, port)
            .WithClientId("runwatch-demo-chamber-" + chamber)
            .WithCleanSession()
            .Build();
        var connect = await client.ConnectAsync(options, cancellationToken).ConfigureAwait(false);
        if (connect.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new InvalidOperationException("demo publisher could not connect: " + connect.ResultCode);
        }
        var simulator = new ChamberSimulator(simulation);
        double growthS = 0;
        foreach (var (step, start, end) in simulator.Schedule())
        {
            if (step.Name == "growth")
            {
                growthS = end - start;
            }
        }
        double acceleration = simulation.Acceleration;
        DateTimeOffset origin = time.GetUtcNow();
        await PublishAsync(client, Topic("event"), Event(origin, "run-start",
            $"\"run\":\"{plan.Run}\",\"wafers\":[{string.Join(',', plan.Wafers.Select(w => "\"" + w + "\""))}],\"recipe\":\"nw-demo\",\"setpoint_c\":{Num(plan.GrowthC)},\"planned_s\":{Num(growthS / acceleration)}"), cancellationToken).ConfigureAwait(false);

        var batch = new StringBuilder(64 * 1024);
        int inBatch = 0;
        int sent = 0;
        long seq = 0;
        string? lastStep = null;
        DateTimeOffset lastT = origin;
        foreach (ChamberSample s in simulator.Run())
        {
            DateTimeOffset t = origin + TimeSpan.FromSeconds(s.TimeS / acceleration);
            lastT = t;
            if (s.Step != lastStep)
            {
                if (inBatch > 0)
                {
                    await FlushAsync(client, batch, cancellationToken).ConfigureAwait(false);
                    inBatch = 0;
                }
                lastStep = s.Step;
                await PublishAsync(client, Topic("event"), Event(t, "step", $"\"step\":\"{s.Step}\""), cancellationToken).ConfigureAwait(false);
            }
            // Pace to the wall clock, so live pages and alerts see the run as it happens.
            TimeSpan ahead = t - time.GetUtcNow();
            if (ahead > TimeSpan.FromMilliseconds(50))
            {
                if (inBatch > 0)
                {
                    await FlushAsync(client, batch, cancellationToken).ConfigureAwait(false);
                    inBatch = 0;
                }
                await Task.Delay(ahead, time, cancellationToken).ConfigureAwait(false);
            }
            batch.Append(batch.Length == 0 ? '[' : ',');
            batch.Append(CultureInfo.InvariantCulture, $"{{\"t\":\"{t.UtcDateTime:yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{++seq},\"values\":{{\"substrate_tc\":{Num(s.SubstrateTcC)},\"substrate_sp\":{Num(s.SubstrateSpC)},\"ga_shutter\":{s.GaShutter}}}}}");
            inBatch++;
            sent++;
            if (inBatch >= 200)
            {
                await FlushAsync(client, batch, cancellationToken).ConfigureAwait(false);
                inBatch = 0;
            }
        }
        if (inBatch > 0)
        {
            await FlushAsync(client, batch, cancellationToken).ConfigureAwait(false);
        }
        await PublishAsync(client, Topic("event"), Event(lastT, "run-end", $"\"run\":\"{plan.Run}\""), cancellationToken).ConfigureAwait(false);
        await client.DisconnectAsync(new MqttClientDisconnectOptions(), cancellationToken).ConfigureAwait(false);
        return sent;
    }

    private async Task FlushAsync(IMqttClient client, StringBuilder batch, CancellationToken cancellationToken)
    {
        batch.Append(']');
        await PublishAsync(client, Topic("telemetry"), batch.ToString(), cancellationToken).ConfigureAwait(false);
        batch.Clear();
    }

    private static async Task PublishAsync(IMqttClient client, string topic, string payload, CancellationToken cancellationToken)
    {
        var message = new MqttApplicationMessageBuilder()
            .WithTopic(topic)
            .WithPayload(Encoding.UTF8.GetBytes(payload))
            .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce)
            .Build();
        await client.PublishAsync(message, cancellationToken).ConfigureAwait(false);
    }

    private static string Event(DateTimeOffset t, string type, string rest) =>
        $"{{\"t\":\"{t.UtcDateTime:yyyy-MM-ddTHH:mm:ss.fffZ}\",\"type\":\"{type}\",{rest}}}";

    private static string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
