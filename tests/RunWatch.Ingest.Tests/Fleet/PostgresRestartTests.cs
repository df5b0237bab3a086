using System.Globalization;
using System.Text;
using Npgsql;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;
using RunWatch.Testing.Postgres;

namespace RunWatch.Ingest.Tests.Fleet;

/// <summary>
/// A real <c>runwatch serve</c> on PostgreSQL (fleet mode, one daemon) while its PostgreSQL server restarts
/// mid-stream: commits fail, nothing is acknowledged that was not committed (the broker keeps and redelivers it),
/// the daemon takes its chamber back when the server returns, and every published sample is stored exactly once.
/// </summary>
public sealed class PostgresRestartTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private const int Total = 20_000;

    [Fact]
    public async Task Serve_PostgresRestartedMidStream_NothingLostNothingTwice()
    {
        await using var broker = await MosquittoBroker.StartAsync(persistence: true);
        await using var postgres = await PostgresServer.StartOwnAsync();
        string database = await postgres.CreateDatabaseAsync("restart");
        string folder = Directory.CreateTempSubdirectory("runwatch-pg-restart-").FullName;
        DateTimeOffset start = DateTimeOffset.UtcNow;
        try
        {
            var settings = DaemonSettings.ForServe(broker.Port, folder, "runwatch-pg-restart");
            settings["Broker:InstanceName"] = "daemon-r";
            settings["Storage:Provider"] = "PostgreSql";
            settings["Storage:ConnectionString"] = database;
            settings["Fleet:Enabled"] = "true";
            settings["Fleet:ClaimInterval"] = "00:00:00.250";
            settings["Ingest:CommitRetryMaxDelay"] = "00:00:01";
            await using var daemon = ServeProcess.Start(folder, settings);
            await FleetHealth.WaitOwnedAsync(daemon, 1, TimeSpan.FromSeconds(60));

            await using var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "gateway-restart");
            var publishing = publisher.PublishManyAsync("runwatch/lab/C1/telemetry", 0, Total, seq => Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
                $"{{\"t\":\"{start.AddMilliseconds(seq):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{seq},\"values\":{{\"substrate_tc\":{600 + (seq % 50) * 0.1:F1}}}}}")), maxInFlight: 200);
            await Poll.UntilAsync(() => Count(database, "SELECT COUNT(*) FROM samples") >= 4_000, TimeSpan.FromSeconds(60), "first 4,000 samples stored");
            long atRestart = Count(database, "SELECT COUNT(*) FROM samples");
            await postgres.RestartAsync();

            Assert.Equal(Total, await publishing);
            long stored = await Poll.UntilReachedOrStalledAsync(() => Count(database, "SELECT COUNT(*) FROM samples"), Total, TimeSpan.FromSeconds(15), TimeSpan.FromSeconds(120));
            string log = string.Join("\n  ", daemon.Output.Split('\n').Where(l => l.Contains("taken over", StringComparison.Ordinal) || l.Contains("Chamber C1", StringComparison.Ordinal) || l.Contains("ERR", StringComparison.Ordinal) || l.Contains("no longer owned", StringComparison.Ordinal)
                || l.Contains("store-unwritable", StringComparison.Ordinal) || l.Contains("Ownership check", StringComparison.Ordinal)));
            output.WriteLine($"stored: {stored}; daemon:\n  {log}");
            File.WriteAllText(Path.Combine(Path.GetTempPath(), "runwatch-pg-restart-daemon.log"), daemon.Output);

            Assert.InRange(atRestart, 4_000, Total - 1);
            // The daemon rode the outage out: no service ended on the store's failure (that would stop the host).
            Assert.DoesNotContain("BackgroundService failed", daemon.Output, StringComparison.Ordinal);
            Assert.NotNull(await daemon.HealthAsync());
            Assert.Equal(Total, stored);
            Assert.Equal(Total, Count(database, "SELECT COUNT(DISTINCT seq) FROM samples"));
            Assert.Equal(Total - 1, Count(database, "SELECT MAX(seq) FROM samples"));
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    private static long Count(string database, string sql)
    {
        try
        {
            using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(database) { Pooling = false }.ConnectionString);
            connection.Open();
            using var command = new NpgsqlCommand(sql, connection);
            return command.ExecuteScalar() is { } value and not DBNull ? Convert.ToInt64(value, CultureInfo.InvariantCulture) : 0;
        }
        catch (NpgsqlException)
        {
            // Table not there yet, or the server is restarting: not counted now.
            return 0;
        }
    }
}
