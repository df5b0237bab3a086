using System.CommandLine;
using System.Globalization;
using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using System.Text;
using MQTTnet;
using MQTTnet.Protocol;
using RunWatch.Ingest.Mqtt;
using RunWatch.Thermal;

namespace RunWatch.Commands;

/// <summary>
/// <c>runwatch replay LOG.csv --speed N</c>: publishes a recorded thermal log (the CSV format of docs/thermal.md,
/// read with the same reader as <c>runwatch thermal</c>) as telemetry, one message per row at QoS 1, paced by the
/// file's own times divided by the speed. By default the times are shifted so that the first row is now (the
/// daemon rejects samples older than Ingest:MaxSampleAge); <c>--keep-times</c> publishes them as recorded.
/// Exit codes: 0 done, 1 the file or the broker could not be used.
/// </summary>
internal static class ReplayCommand
{
    public static Command Create()
    {
        var log = new Argument<FileInfo>("log") { Description = "Thermal log in CSV: a timestamp column and one column per channel (see docs/thermal.md)." };
        var speed = new Option<double>("--speed") { Description = "Replay speed: 1 = as recorded, 10 = ten times faster, 0 = as fast as the broker takes it.", DefaultValueFactory = _ => 1.0 };
        var host = new Option<string>("--host") { Description = "Broker host.", DefaultValueFactory = _ => "127.0.0.1" };
        var port = new Option<int>("--port") { Description = "Broker port.", DefaultValueFactory = _ => 1883 };
        var username = new Option<string?>("--username") { Description = "Broker user name; the password comes from the environment variable RUNWATCH_BROKER_PASSWORD." };
        var tls = new Option<bool>("--tls") { Description = "Connect with TLS (system trust store, or --ca-file)." };
        var caFile = new Option<FileInfo?>("--ca-file") { Description = "PEM file of the CA that signed the broker's certificate (implies --tls), as the daemon's Broker:CaFile." };
        var root = new Option<string>("--topic-root") { Description = "First topic level.", DefaultValueFactory = _ => "runwatch" };
        var site = new Option<string>("--site") { Description = "Site (second topic level).", DefaultValueFactory = _ => "lab" };
        var chamber = new Option<string>("--chamber") { Description = "Chamber (third topic level).", DefaultValueFactory = _ => "demo-1" };
        var run = new Option<string?>("--run") { Description = "Also publish run-start before the first row and run-end after the last, with this run name." };
        var keepTimes = new Option<bool>("--keep-times") { Description = "Publish the file's own ISO-8601 times instead of shifting the first row to now." };

        var command = new Command("replay", "Publish a recorded thermal log to the broker as telemetry, for testing and for re-running a past run.")
        {
            log, speed, host, port, username, tls, caFile, root, site, chamber, run, keepTimes,
        };
        command.SetAction(async (parseResult, cancellationToken) =>
        {
            TextWriter output = parseResult.InvocationConfiguration.Output;
            TextWriter error = parseResult.InvocationConfiguration.Error;
            FileInfo file = parseResult.GetRequiredValue(log);
            double pace = parseResult.GetValue(speed);
            if (!(pace >= 0) || !double.IsFinite(pace))
            {
                await error.WriteLineAsync("--speed must be 0 or a positive number").ConfigureAwait(false);
                return 1;
            }
            ThermalCsv csv;
            try
            {
                using var reader = file.OpenText();
                csv = ThermalCsvReader.Read(reader);
            }
            catch (Exception ex) when (ex is ThermalCsvException or IOException or UnauthorizedAccessException)
            {
                await error.WriteLineAsync(file.Name + ": " + ex.Message).ConfigureAwait(false);
                return 1;
            }
            if (parseResult.GetValue(keepTimes) && csv.Origin is null)
            {
                await error.WriteLineAsync("--keep-times needs ISO-8601 timestamps in the file").ConfigureAwait(false);
                return 1;
            }
            var origin = parseResult.GetValue(keepTimes) ? csv.Origin!.Value : DateTimeOffset.UtcNow;
            string prefix = parseResult.GetRequiredValue(root) + "/" + parseResult.GetRequiredValue(site) + "/" + parseResult.GetRequiredValue(chamber);

            using var client = new MqttClientFactory().CreateMqttClient();
            var options = new MqttClientOptionsBuilder()
                .WithTcpServer(parseResult.GetRequiredValue(host), parseResult.GetValue(port))
                .WithClientId("runwatch-replay-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture))
                .WithCleanStart(true);
            if (parseResult.GetValue(username) is { Length: > 0 } user)
            {
                options.WithCredentials(user, Environment.GetEnvironmentVariable("RUNWATCH_BROKER_PASSWORD"));
            }
            X509Certificate2? ca = null;
            if (parseResult.GetValue(caFile) is { } caPath)
            {
                try
                {
                    ca = X509CertificateLoader.LoadCertificateFromFile(caPath.FullName);
                }
                catch (Exception ex) when (ex is CryptographicException or IOException or UnauthorizedAccessException)
                {
                    await error.WriteLineAsync("--ca-file " + caPath.Name + ": not a readable PEM or DER certificate (" + ex.Message + ")").ConfigureAwait(false);
                    return 1;
                }
            }
            using var caOwner = ca;
            if (parseResult.GetValue(tls) || ca is not null)
            {
                string target = parseResult.GetRequiredValue(host);
                options.WithTlsOptions(o =>
                {
                    o.UseTls(true);
                    o.WithTargetHost(target);
                    if (ca is not null)
                    {
                        o.WithCertificateValidationHandler(args => BrokerCertificate.ChainsToCa(args.Certificate, args.SslPolicyErrors, ca));
                    }
                });
            }
            try
            {
                var connected = await client.ConnectAsync(options.Build(), cancellationToken).ConfigureAwait(false);
                if (connected.ResultCode != MqttClientConnectResultCode.Success)
                {
                    await error.WriteLineAsync("broker refused the connection: " + connected.ResultCode).ConfigureAwait(false);
                    return 1;
                }
                int published = await PublishAsync(client, csv, prefix, origin, pace, parseResult.GetValue(run), cancellationToken).ConfigureAwait(false);
                await output.WriteLineAsync(string.Create(CultureInfo.InvariantCulture, $"published {published} telemetry messages from {file.Name} to {prefix}/telemetry")).ConfigureAwait(false);
                await client.DisconnectAsync(new MqttClientDisconnectOptions(), cancellationToken).ConfigureAwait(false);
                return 0;
            }
            catch (Exception ex) when (ex is MQTTnet.Exceptions.MqttCommunicationException or System.Net.Sockets.SocketException or InvalidOperationException)
            {
                await error.WriteLineAsync("broker: " + ex.Message).ConfigureAwait(false);
                return 1;
            }
        });
        return command;
    }

    private static async Task<int> PublishAsync(IMqttClient client, ThermalCsv csv, string prefix, DateTimeOffset origin, double pace, string? run, CancellationToken cancellationToken)
    {
        double[][] columns = [.. csv.Channels.Select(csv.Column)];
        string[] names = [.. csv.Channels.Select(c => System.Text.Json.JsonEncodedText.Encode(c).ToString())];
        var times = csv.TimesS;
        double firstS = times.Count > 0 ? times[0] : 0;
        var started = System.Diagnostics.Stopwatch.StartNew();
        if (run is not null && times.Count > 0)
        {
            await SendAsync(client, prefix + "/event", EventJson(origin, "run-start", run), cancellationToken).ConfigureAwait(false);
        }
        int published = 0;
        var json = new StringBuilder(256);
        for (int row = 0; row < times.Count; row++)
        {
            double offsetS = times[row] - firstS;
            if (pace > 0)
            {
                var due = TimeSpan.FromSeconds(offsetS / pace) - started.Elapsed;
                if (due > TimeSpan.Zero)
                {
                    await Task.Delay(due, cancellationToken).ConfigureAwait(false);
                }
            }
            json.Clear();
            json.Append("{\"t\":\"").Append(Iso(origin.AddSeconds(offsetS))).Append("\",\"seq\":").Append(row.ToString(CultureInfo.InvariantCulture)).Append(",\"values\":{");
            bool any = false;
            for (int c = 0; c < columns.Length; c++)
            {
                double v = columns[c][row];
                if (double.IsNaN(v))
                {
                    continue;
                }
                json.Append(any ? "," : "").Append('"').Append(names[c]).Append("\":").Append(v.ToString("R", CultureInfo.InvariantCulture));
                any = true;
            }
            json.Append("}}");
            if (any)
            {
                await SendAsync(client, prefix + "/telemetry", json.ToString(), cancellationToken).ConfigureAwait(false);
                published++;
            }
        }
        if (run is not null && times.Count > 0)
        {
            await SendAsync(client, prefix + "/event", EventJson(origin.AddSeconds(times[^1] - firstS), "run-end", run), cancellationToken).ConfigureAwait(false);
        }
        return published;
    }

    private static async Task SendAsync(IMqttClient client, string topic, string payload, CancellationToken cancellationToken)
    {
        var message = new MqttApplicationMessageBuilder().WithTopic(topic).WithPayload(payload).WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce).Build();
        var result = await client.PublishAsync(message, cancellationToken).ConfigureAwait(false);
        if (!result.IsSuccess)
        {
            throw new InvalidOperationException("the broker refused a publish on " + topic + ": " + result.ReasonCode);
        }
    }

    private static string EventJson(DateTimeOffset at, string type, string run) =>
        "{\"t\":\"" + Iso(at) + "\",\"type\":\"" + type + "\",\"run\":" + System.Text.Json.JsonSerializer.Serialize(run, RunWatch.Hosting.ReplayJsonContext.Default.String) + "}";

    private static string Iso(DateTimeOffset t) => t.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.ffffff'Z'", CultureInfo.InvariantCulture);
}
