using System.Diagnostics;
using System.Globalization;
using System.Text;
using Microsoft.Data.Sqlite;
using Npgsql;
using RunWatch.Testing.Mqtt;
using RunWatch.Testing.Postgres;

namespace RunWatch.Benchmarks;

/// <summary>
/// Fleet ingest: the same queued stream (four chambers, QoS 1, one sample per message) drained by two daemons on
/// PostgreSQL (fleet mode, two chambers each), by one daemon on PostgreSQL (fleet mode, all four chambers) and by one
/// daemon on SQLite, each with its own fresh broker and store. The consumers' sessions are made first, the burst is
/// queued at the broker while they are away, then they start; the rate runs from the first sample stored to the last
/// (daemon start-up excluded; the stores are polled every 50 ms).
/// </summary>
internal sealed class FleetIngestBenchmark : IBenchmark
{
    private static readonly string[] Chambers = ["C1", "C2", "C3", "C4"];

    public string Name => "fleet-ingest";

    public string Description => "Queued QoS 1 stream of four chambers: two daemons on PostgreSQL vs one daemon on PostgreSQL vs one on SQLite";

    public int Run(bool quick, TextWriter output) => RunAsync(quick, output).GetAwaiter().GetResult();

    private static async Task<int> RunAsync(bool quick, TextWriter output)
    {
        int perChamber = quick ? 15_000 : 100_000;
        var postgres = await PostgresServer.SharedAsync().ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   {Chambers.Length} chambers x {perChamber:N0} messages queued at the broker, one sample each"));
        double two = await DrainAsync(postgres, perChamber, daemons: 2).ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   two daemons, PostgreSQL (fleet):  {two,10:N0} samples/s"));
        double one = await DrainAsync(postgres, perChamber, daemons: 1).ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   one daemon, PostgreSQL (fleet):   {one,10:N0} samples/s"));
        double sqlite = await DrainAsync(null, perChamber, daemons: 1).ConfigureAwait(false);
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   one daemon, SQLite:               {sqlite,10:N0} samples/s"));
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"   ratios: two/one PostgreSQL {two / one:F2}; one PostgreSQL / SQLite {one / sqlite:F2}; two PostgreSQL / SQLite {two / sqlite:F2}"));
        output.WriteLine("   (both daemons and PostgreSQL share this machine's cores: a second daemon on its own host adds its CPU, here it competes)");
        return 0;
    }

    private static async Task<double> DrainAsync(PostgresServer? postgres, int perChamber, int daemons)
    {
        await using var broker = await MosquittoBroker.StartAsync().ConfigureAwait(false);
        string? database = postgres is null ? null : await postgres.CreateDatabaseAsync("fleetbench").ConfigureAwait(false);
        var folders = Enumerable.Range(0, daemons).Select(_ => Directory.CreateTempSubdirectory("runwatch-fleet-bench-").FullName).ToList();
        try
        {
            var settings = folders.Select((folder, i) => Settings(broker.Port, folder, "bench-" + i.ToString(CultureInfo.InvariantCulture), database, daemons)).ToList();
            // 1. Make the sessions (fleet: one per chamber, owned by whichever daemon; SQLite: the daemon's own), then leave.
            var first = settings.Select((s, i) => ServeProcess.Start(folders[i], s)).ToList();
            await WaitReadyAsync(first, database is not null).ConfigureAwait(false);
            foreach (var daemon in first)
            {
                await daemon.StopAsync().ConfigureAwait(false);
                await daemon.DisposeAsync().ConfigureAwait(false);
            }
            // 2. Queue the burst.
            var start = DateTimeOffset.UtcNow;
            await Task.WhenAll(Chambers.Select(async chamber =>
            {
                await using var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "bench-gateway-" + chamber).ConfigureAwait(false);
                await publisher.PublishManyAsync("runwatch/lab/" + chamber + "/telemetry", 0, perChamber, seq => Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
                    $"{{\"t\":\"{start.AddMilliseconds(seq):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{seq},\"values\":{{\"substrate_tc\":{600 + (seq % 50) * 0.1:F1}}}}}")), maxInFlight: 1000).ConfigureAwait(false);
            })).ConfigureAwait(false);
            // 3. Drain: from the daemons' start to the last sample stored.
            long target = (long)perChamber * Chambers.Length;
            var clock = Stopwatch.StartNew();
            var second = settings.Select((s, i) => ServeProcess.Start(folders[i], s)).ToList();
            try
            {
                double lastChange = 0;
                double firstStored = double.NaN;
                long firstCount = 0;
                long last = -1;
                while (true)
                {
                    long count = Count(database, folders[0]);
                    if (count > 0 && double.IsNaN(firstStored))
                    {
                        firstStored = clock.Elapsed.TotalSeconds;
                        firstCount = count;
                    }
                    if (count != last)
                    {
                        last = count;
                        lastChange = clock.Elapsed.TotalSeconds;
                    }
                    if (count >= target || clock.Elapsed.TotalSeconds - lastChange > 30)
                    {
                        return (count - firstCount) / Math.Max(1e-3, lastChange - firstStored);
                    }
                    await Task.Delay(50).ConfigureAwait(false);
                }
            }
            finally
            {
                foreach (var daemon in second)
                {
                    await daemon.StopAsync().ConfigureAwait(false);
                    await daemon.DisposeAsync().ConfigureAwait(false);
                }
            }
        }
        finally
        {
            if (database is not null)
            {
                await postgres!.DropDatabaseAsync(database).ConfigureAwait(false);
            }
            SqliteConnection.ClearAllPools();
            foreach (string folder in folders)
            {
                Directory.Delete(folder, recursive: true);
            }
        }
    }

    private static Dictionary<string, string> Settings(int brokerPort, string folder, string instance, string? database, int daemons)
    {
        var settings = DaemonSettings.ForServe(brokerPort, folder, "runwatch-" + instance);
        settings["Broker:InstanceName"] = instance;
        settings["Alerts:Log"] = "false";
        for (int c = 1; c < Chambers.Length; c++)
        {
            foreach (var (key, value) in settings.Where(kv => kv.Key.StartsWith("Chambers:0:", StringComparison.Ordinal)).ToList())
            {
                settings["Chambers:" + c.ToString(CultureInfo.InvariantCulture) + ":" + key["Chambers:0:".Length..]] = key == "Chambers:0:Name" ? Chambers[c] : value;
            }
        }
        if (database is not null)
        {
            settings["Storage:Provider"] = "PostgreSql";
            settings["Storage:ConnectionString"] = database;
            settings["Fleet:Enabled"] = "true";
            settings["Fleet:ClaimInterval"] = "00:00:00.250";
            settings["Fleet:MaxOwnedChambers"] = (Chambers.Length / daemons).ToString(CultureInfo.InvariantCulture);
        }
        return settings;
    }

    private static async Task WaitReadyAsync(List<ServeProcess> daemons, bool fleet)
    {
        foreach (var daemon in daemons)
        {
            await daemon.WaitConnectedAsync(TimeSpan.FromSeconds(60)).ConfigureAwait(false);
        }
        if (!fleet)
        {
            return;
        }
        var deadline = DateTime.UtcNow + TimeSpan.FromSeconds(60);
        while (DateTime.UtcNow < deadline)
        {
            int owned = 0;
            foreach (var daemon in daemons)
            {
                using var health = await daemon.HealthAsync().ConfigureAwait(false);
                if (health is not null && health.RootElement.GetProperty("checks").TryGetProperty("fleet", out var check) && check.TryGetProperty("owned", out var list))
                {
                    owned += list.GetArrayLength();
                }
            }
            if (owned == Chambers.Length)
            {
                return;
            }
            await Task.Delay(100).ConfigureAwait(false);
        }
        throw new TimeoutException("the fleet did not take every chamber");
    }

    private static long Count(string? database, string folder)
    {
        try
        {
            if (database is not null)
            {
                using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(database) { Pooling = false }.ConnectionString);
                connection.Open();
                using var command = new NpgsqlCommand("SELECT COUNT(*) FROM samples", connection);
                return (long)command.ExecuteScalar()!;
            }
            using var sqlite = new SqliteConnection("Data Source=" + Path.Combine(folder, "runwatch.db") + ";Mode=ReadOnly;Pooling=False");
            sqlite.Open();
            using var query = sqlite.CreateCommand();
            query.CommandText = "SELECT COUNT(*) FROM samples";
            return (long)query.ExecuteScalar()!;
        }
        catch (Exception ex) when (ex is NpgsqlException or SqliteException)
        {
            return 0;
        }
    }
}
