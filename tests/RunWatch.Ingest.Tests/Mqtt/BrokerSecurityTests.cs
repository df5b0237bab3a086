using System.Diagnostics;
using System.Globalization;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Mqtt;

/// <summary>Against a Mosquitto with TLS and password authentication, as the sample production config has.</summary>
public sealed class BrokerSecurityTests
{
    [Fact]
    public async Task Ingest_TlsWithCaFileAndPassword_ConnectsAndStores()
    {
        await using var broker = await MosquittoBroker.StartWithConfigAsync(SecureConfig);
        await using var daemon = await InProcessDaemon.StartAsync(broker.Port, s =>
        {
            s["Broker:UseTls"] = "true";
            s["Broker:CaFile"] = Path.Combine(broker.Folder, "ca.crt");
            s["Broker:Username"] = "runwatch";
            s["Broker:PasswordFile"] = Path.Combine(broker.Folder, "daemon-password");
        });

        await PublishTlsAsync(broker, "{\"t\":\"" + DateTimeOffset.UtcNow.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture) + "\",\"seq\":1,\"values\":{\"substrate_tc\":605}}");

        await Poll.UntilAsync(() => daemon.Scalar("SELECT COUNT(*) FROM samples") == 1, TimeSpan.FromSeconds(15), "sample over TLS");
    }

    [Fact]
    public async Task Ingest_WrongPassword_StaysDisconnectedWithReasonAndRetries()
    {
        await using var broker = await MosquittoBroker.StartWithConfigAsync(SecureConfig);
        string folder = Directory.CreateTempSubdirectory("runwatch-badpw-").FullName;
        var settings = DaemonSettings.ForTestChamber(broker.Port, folder);
        settings["Broker:UseTls"] = "true";
        settings["Broker:CaFile"] = Path.Combine(broker.Folder, "ca.crt");
        settings["Broker:Username"] = "runwatch";
        settings["Broker:Password"] = "not-the-password";
        var builder = Microsoft.Extensions.Hosting.Host.CreateApplicationBuilder();
        Microsoft.Extensions.Configuration.MemoryConfigurationBuilderExtensions.AddInMemoryCollection(builder.Configuration, settings);
        Microsoft.Extensions.DependencyInjection.ServiceCollectionServiceExtensions.AddSingleton(builder.Services, Prometheus.Metrics.NewCustomRegistry());
        builder.Services.AddRunWatchIngest(builder.Configuration);
        using var host = builder.Build();
        await host.StartAsync();
        try
        {
            var health = Microsoft.Extensions.DependencyInjection.ServiceProviderServiceExtensions.GetRequiredService<IngestHealth>(host.Services);
            await Poll.UntilAsync(() => health.Snapshot().BrokerError is { } e && e.Contains("refused", StringComparison.OrdinalIgnoreCase), TimeSpan.FromSeconds(15), "refusal reported");
            Assert.NotEqual(BrokerConnectionState.Connected, health.Snapshot().BrokerState);
            Assert.DoesNotContain("not-the-password", health.Snapshot().BrokerError!, StringComparison.Ordinal);
        }
        finally
        {
            await host.StopAsync();
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(folder, recursive: true);
        }
    }

    private static string SecureConfig(int port, string folder)
    {
        TestCertificates.Create(folder);
        File.WriteAllText(Path.Combine(folder, "daemon-password"), "daemon-secret\n");
        var passwd = Path.Combine(folder, "passwd");
        RunPasswd("-c", "-b", passwd, "runwatch", "daemon-secret");
        RunPasswd("-b", passwd, "gateway", "gateway-secret");
        return string.Join('\n',
            // Run as root, Mosquitto drops to its own user and could not read the key and password files in the
            // caller's temp folder; "user" has no effect when the tests run unprivileged.
            "user root",
            "per_listener_settings false",
            "allow_anonymous false",
            "password_file " + passwd,
            string.Create(CultureInfo.InvariantCulture, $"listener {port} 127.0.0.1"),
            "cafile " + Path.Combine(folder, "ca.crt"),
            "certfile " + Path.Combine(folder, "broker.crt"),
            "keyfile " + Path.Combine(folder, "broker.key"),
            "max_queued_messages 0",
            "persistence false",
            "log_dest stdout",
            "");
    }

    private static void RunPasswd(params string[] args)
    {
        var psi = new ProcessStartInfo("mosquitto_passwd") { UseShellExecute = false, RedirectStandardError = true };
        foreach (string a in args)
        {
            psi.ArgumentList.Add(a);
        }
        using var p = Process.Start(psi)!;
        p.WaitForExit();
        Assert.Equal(0, p.ExitCode);
    }

    private static async Task PublishTlsAsync(MosquittoBroker broker, string payload)
    {
        var psi = new ProcessStartInfo(MosquittoClients.Pub) { UseShellExecute = false, RedirectStandardError = true };
        foreach (string a in new[] { "-h", "127.0.0.1", "-p", broker.Port.ToString(CultureInfo.InvariantCulture), "--cafile", Path.Combine(broker.Folder, "ca.crt"),
            "-u", "gateway", "-P", "gateway-secret", "-q", "1", "-i", "tls-gateway", "-t", "runwatch/lab/C1/telemetry", "-m", payload })
        {
            psi.ArgumentList.Add(a);
        }
        using var p = Process.Start(psi)!;
        string error = await p.StandardError.ReadToEndAsync();
        await p.WaitForExitAsync();
        Assert.True(p.ExitCode == 0, "mosquitto_pub over TLS failed: " + error);
    }
}
