using System.Diagnostics;
using System.Globalization;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Mqtt;

/// <summary>
/// The daemon announces its maximum packet size (MQTT 5) to a real Mosquitto without a message size limit of its own:
/// a 2 MB payload never reaches the daemon, a moderately oversize one still arrives and is counted as oversize.
/// </summary>
public sealed class PacketSizeTests
{
    [Fact]
    public async Task Ingest_PayloadAbovePacketLimit_NeverDelivered_AboveMaxPayload_CountedOversize()
    {
        await using var broker = await MosquittoBroker.StartAsync();
        await using var daemon = await InProcessDaemon.StartAsync(broker.Port, s =>
        {
            s["Ingest:MaxPayloadBytes"] = "1024";
            s["Broker:MaximumPacketBytes"] = "65536";
        });
        string t = DateTimeOffset.UtcNow.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture);
        string huge = "{\"t\":\"" + t + "\",\"values\":{\"substrate_tc\":600},\"pad\":\"" + new string('x', 2_000_000) + "\"}";
        string oversize = "{\"t\":\"" + t + "\",\"values\":{\"substrate_tc\":601},\"pad\":\"" + new string('y', 10_000) + "\"}";
        string small = "{\"t\":\"" + t + "\",\"seq\":3,\"values\":{\"substrate_tc\":602}}";

        foreach (string payload in new[] { huge, oversize, small })
        {
            await PublishFileAsync(broker.Port, payload);
        }

        await Poll.UntilAsync(() => daemon.Scalar("SELECT COUNT(*) FROM samples") == 1, TimeSpan.FromSeconds(15), "small sample stored");
        await Poll.UntilAsync(() => daemon.Scalar("SELECT COUNT(*) FROM dead_letters WHERE reason = 'oversize'") >= 1, TimeSpan.FromSeconds(15), "oversize counted");
        Assert.Equal(1, daemon.Scalar("SELECT COUNT(*) FROM dead_letters WHERE reason = 'oversize'"));
        Assert.Equal(0, daemon.Scalar("SELECT COUNT(*) FROM dead_letters WHERE payload_len > 65536"));
    }

    /// <summary>mosquitto_pub -f: a payload above the 128 KiB limit of one command-line argument.</summary>
    private static async Task PublishFileAsync(int port, string payload)
    {
        string file = Path.GetTempFileName();
        try
        {
            await File.WriteAllTextAsync(file, payload);
            var psi = new ProcessStartInfo(MosquittoClients.Pub) { UseShellExecute = false, RedirectStandardError = true };
            foreach (string a in new[] { "-h", "127.0.0.1", "-p", port.ToString(CultureInfo.InvariantCulture), "-q", "1", "-i", "big-publisher", "-t", "runwatch/lab/C1/telemetry", "-f", file })
            {
                psi.ArgumentList.Add(a);
            }
            using var process = Process.Start(psi)!;
            string error = await process.StandardError.ReadToEndAsync();
            await process.WaitForExitAsync();
            Assert.True(process.ExitCode == 0, "mosquitto_pub failed: " + error);
        }
        finally
        {
            File.Delete(file);
        }
    }
}
