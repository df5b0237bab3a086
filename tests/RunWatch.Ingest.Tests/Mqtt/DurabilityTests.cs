using System.Globalization;
using System.Text;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Mqtt;

/// <summary>No loss, no duplicate: the daemon killed mid-stream, and the broker restarted mid-stream.</summary>
public sealed class DurabilityTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private static readonly DateTimeOffset Start = DateTimeOffset.UtcNow.AddMinutes(-10);

    [Fact]
    public async Task Serve_KilledWithSigkillWhilePublishing50000_RestartStoresEverySampleExactlyOnce()
    {
        const int Total = 50_000;
        await using var broker = await MosquittoBroker.StartAsync(persistence: true);
        string folder = Directory.CreateTempSubdirectory("runwatch-crash-").FullName;
        try
        {
            var settings = ServeSettings(broker.Port, folder);
            string database = Path.Combine(folder, "runwatch.db");
            var first = ServeProcess.Start(folder, settings);
            await first.WaitConnectedAsync(TimeSpan.FromSeconds(30));

            await using var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "crash-publisher");
            var publishing = publisher.PublishManyAsync("runwatch/lab/C1/telemetry", 0, Total, Payload, maxInFlight: 200);
            await Poll.UntilAsync(() => File.Exists(database) && Count(database) >= 5_000, TimeSpan.FromSeconds(60), "first 5000 samples stored");
            first.Kill();
            long atKill = Count(database);
            bool publisherStillRunning = !publishing.IsCompleted;
            await first.DisposeAsync();

            Assert.Equal(Total, await publishing);
            Assert.True(publisherStillRunning, "the kill must happen while the publisher is still sending");
            Assert.InRange(atKill, 5_000, Total - 1);

            await using var second = ServeProcess.Start(folder, settings);
            await second.WaitConnectedAsync(TimeSpan.FromSeconds(30));
            long stored = await Poll.UntilReachedOrStalledAsync(() => Count(database), Total, TimeSpan.FromSeconds(15), TimeSpan.FromSeconds(90));

            string metrics = await second.MetricsAsync();
            output.WriteLine("stored at kill: " + atKill.ToString(CultureInfo.InvariantCulture) + "; after restart: " + stored.ToString(CultureInfo.InvariantCulture));
            output.WriteLine(string.Join('\n', metrics.Split('\n').Where(l => l.StartsWith("runwatch_ingest_rejects_total{reason=\"duplicate\"}", StringComparison.Ordinal) || l.StartsWith("runwatch_ingest_samples_total", StringComparison.Ordinal))));
            Assert.Equal(Total, stored);
            Assert.Equal(Total, InProcessDaemon.SqliteScalar(database, "SELECT COUNT(DISTINCT seq) FROM samples"));
            foreach (string series in new[] { "runwatch_ingest_samples_total", "runwatch_ingest_rejects_total{reason=\"malformed_json\"}", "runwatch_ingest_batch_commit_seconds_count",
                "runwatch_ingest_queue_depth", "runwatch_alerts_active", "runwatch_broker_connected 1" })
            {
                Assert.Contains(series, metrics, StringComparison.Ordinal);
            }
            Assert.DoesNotContain("process_cpu_seconds_total", metrics, StringComparison.Ordinal);
            Assert.Equal(0, InProcessDaemon.SqliteScalar(database, "SELECT MIN(seq) FROM samples"));
            Assert.Equal(Total - 1, InProcessDaemon.SqliteScalar(database, "SELECT MAX(seq) FROM samples"));
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public async Task Ingest_BrokerRestartedMidStream_ReconnectsByItselfAndLosesNothing()
    {
        const int PerPhase = 10_000;
        await using var broker = await MosquittoBroker.StartAsync(persistence: true);
        await using var daemon = await InProcessDaemon.StartAsync(broker.Port);

        await using (var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "restart-publisher-1"))
        {
            Assert.Equal(PerPhase, await publisher.PublishManyAsync("runwatch/lab/C1/telemetry", 0, PerPhase, Payload, maxInFlight: 200));
        }
        await broker.StopAsync();
        await Poll.UntilAsync(() => daemon.Health.Snapshot().BrokerState != BrokerConnectionState.Connected, TimeSpan.FromSeconds(10), "daemon noticed the broker is gone");
        long duringOutage = daemon.Scalar("SELECT COUNT(*) FROM samples");
        await broker.RestartAsync();
        await Poll.UntilAsync(() => daemon.Health.Snapshot().BrokerState == BrokerConnectionState.Connected, TimeSpan.FromSeconds(30), "daemon reconnected");
        await using (var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "restart-publisher-2"))
        {
            Assert.Equal(PerPhase, await publisher.PublishManyAsync("runwatch/lab/C1/telemetry", PerPhase, PerPhase, Payload, maxInFlight: 200));
        }

        long stored = await Poll.UntilReachedOrStalledAsync(() => daemon.Scalar("SELECT COUNT(*) FROM samples"), 2 * PerPhase, TimeSpan.FromSeconds(10), TimeSpan.FromSeconds(60));

        Assert.True(duringOutage <= PerPhase);
        Assert.Equal(2 * PerPhase, stored);
        Assert.Equal(2 * PerPhase, daemon.Scalar("SELECT COUNT(DISTINCT seq) FROM samples"));
    }

    private static Dictionary<string, string> ServeSettings(int brokerPort, string folder) => DaemonSettings.ForServe(brokerPort, folder, "runwatch-crash-test");

    private static long Count(string database)
    {
        try
        {
            return InProcessDaemon.SqliteScalar(database, "SELECT COUNT(*) FROM samples");
        }
        catch (Microsoft.Data.Sqlite.SqliteException)
        {
            // Before the first migration the table does not exist yet.
            return 0;
        }
    }

    private static byte[] Payload(int seq) => Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
        $"{{\"t\":\"{Start.AddMilliseconds(seq):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{seq},\"values\":{{\"substrate_tc\":{600 + (seq % 50) * 0.1:F1}}}}}"));
}
