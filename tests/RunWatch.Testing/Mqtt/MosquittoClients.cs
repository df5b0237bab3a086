using System.Diagnostics;
using System.Globalization;

namespace RunWatch.Testing.Mqtt;

/// <summary>Runs Debian's mosquitto_pub, an MQTT client independent of ours.</summary>
public static class MosquittoClients
{
    public const string Pub = "/usr/bin/mosquitto_pub";

    public const string Sub = "/usr/bin/mosquitto_sub";

    /// <summary>Publishes one message per line of <paramref name="lines"/> at QoS 1 with <c>-l</c>. Keep to ≤ 50 000 lines per call (mosquitto_pub 2.0.11 stops near 65 535).</summary>
    public static async Task PublishLinesAsync(int port, string topic, IReadOnlyList<string> lines, string clientId)
    {
        if (lines.Count > 50_000)
        {
            throw new ArgumentOutOfRangeException(nameof(lines), "mosquitto_pub -l stops early past about 65 535 lines; publish in chunks");
        }
        var psi = new ProcessStartInfo(Pub)
        {
            RedirectStandardInput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (string a in new[] { "-h", "127.0.0.1", "-p", port.ToString(CultureInfo.InvariantCulture), "-q", "1", "-i", clientId, "-t", topic, "-l" })
        {
            psi.ArgumentList.Add(a);
        }
        using var process = Process.Start(psi)!;
        foreach (string line in lines)
        {
            await process.StandardInput.WriteLineAsync(line).ConfigureAwait(false);
        }
        process.StandardInput.Close();
        string stderr = await process.StandardError.ReadToEndAsync().ConfigureAwait(false);
        await process.WaitForExitAsync().ConfigureAwait(false);
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException("mosquitto_pub failed (" + process.ExitCode.ToString(CultureInfo.InvariantCulture) + "): " + stderr);
        }
    }

    /// <summary>Publishes one message (<c>-m</c>) at QoS 1.</summary>
    public static Task PublishAsync(int port, string topic, string payload, string clientId) =>
        PublishLinesAsync(port, topic, [payload], clientId);
}
