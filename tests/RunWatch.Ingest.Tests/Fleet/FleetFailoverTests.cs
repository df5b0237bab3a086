using System.Diagnostics;
using System.Globalization;
using System.Text;
using Npgsql;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Testing.Mqtt;
using RunWatch.Testing.Postgres;

namespace RunWatch.Ingest.Tests.Fleet;

/// <summary>
/// Two real <c>runwatch serve</c> daemons in fleet mode on one PostgreSQL database and one Mosquitto with persistence;
/// three chambers each publish 30,000 numbered QoS 1 samples inside a run with two excursions; the daemon that owns
/// two chambers is killed with SIGKILL mid-stream and the other takes them over. Truth: the publishers' own numbers
/// (every seq stored exactly once), and chamber C3, which never changed owner and saw the same stream, as the
/// control for the run's figures and the alert records.
/// </summary>
public sealed class FleetFailoverTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private const int PerChamber = 30_000;
    private static readonly string[] Chambers = ["C1", "C2", "C3"];

    [Fact]
    public async Task Fleet_OwnerOfTwoChambersKilledMidStream_OtherDaemonTakesOverAndEverySampleIsStoredOnce()
    {
        await using var broker = await MosquittoBroker.StartAsync(persistence: true);
        var postgres = await PostgresServer.SharedAsync();
        string database = await postgres.CreateDatabaseAsync("failover");
        string folderA = Directory.CreateTempSubdirectory("runwatch-fleet-a-").FullName;
        string folderB = Directory.CreateTempSubdirectory("runwatch-fleet-b-").FullName;
        DateTimeOffset start = DateTimeOffset.UtcNow;
        try
        {
            // daemon-a takes at most two chambers and starts first, so it owns C1 and C2; daemon-b gets C3.
            await using var daemonA = ServeProcess.Start(folderA, Settings(broker.Port, folderA, "daemon-a", database, maxOwned: 2));
            await FleetHealth.WaitOwnedAsync(daemonA, 2, TimeSpan.FromSeconds(60));
            await using var daemonB = ServeProcess.Start(folderB, Settings(broker.Port, folderB, "daemon-b", database, maxOwned: 0));
            await FleetHealth.WaitOwnedAsync(daemonB, 1, TimeSpan.FromSeconds(60));
            Assert.Equal(["C1", "C2"], await FleetHealth.OwnedAsync(daemonA));
            Assert.Equal(["C3"], await FleetHealth.OwnedAsync(daemonB));

            var publishers = new List<MqttTestPublisher>();
            var publishing = new List<Task<int>>();
            foreach (string chamber in Chambers)
            {
                var publisher = await MqttTestPublisher.ConnectAsync(broker.Port, "gateway-" + chamber);
                publishers.Add(publisher);
                await publisher.PublishAsync("runwatch/lab/" + chamber + "/event", Event(start, "run-start"));
                publishing.Add(publisher.PublishManyAsync("runwatch/lab/" + chamber + "/telemetry", 0, PerChamber, seq => Sample(start, seq), maxInFlight: 200));
            }

            await Poll.UntilAsync(() => Count(database, "SELECT COUNT(*) FROM samples") >= 15_000, TimeSpan.FromSeconds(120), "first 15,000 samples stored");
            var clock = Stopwatch.StartNew();
            daemonA.Kill();
            long atKill = Count(database, "SELECT COUNT(*) FROM samples");
            bool stillPublishing = publishing.Any(p => !p.IsCompleted);
            await FleetHealth.WaitOwnedAsync(daemonB, 3, TimeSpan.FromSeconds(60));
            double takeoverS = clock.Elapsed.TotalSeconds;

            int[] published = await Task.WhenAll(publishing);
            foreach (var (chamber, publisher) in Chambers.Zip(publishers))
            {
                await publisher.PublishAsync("runwatch/lab/" + chamber + "/event", Event(start.AddMilliseconds(PerChamber + 1000), "run-end"));
            }
            long stored = await Poll.UntilReachedOrStalledAsync(() => Count(database, "SELECT COUNT(*) FROM samples"), 3L * PerChamber * 2,
                TimeSpan.FromSeconds(15), TimeSpan.FromSeconds(180));
            await Poll.UntilAsync(() => Count(database, "SELECT COUNT(*) FROM runs WHERE status = 'closed' AND l_eff_nm IS NOT NULL") == 3,
                TimeSpan.FromSeconds(60), "three runs closed and evaluated");
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"stored at kill: {atKill:N0}; takeover (SIGKILL to daemon-b owning C1 and C2 by /healthz): {takeoverS:F2} s; samples after the run: {stored:N0}"));
            foreach (var publisher in publishers)
            {
                await publisher.DisposeAsync();
            }

            Assert.True(stillPublishing, "the kill must happen while the publishers are still sending");
            Assert.All(published, p => Assert.Equal(PerChamber, p));
            // Two samples per message (growth temperature and setpoint), each stored exactly once.
            Assert.Equal(3L * PerChamber * 2, stored);
            foreach (string chamber in Chambers)
            {
                Assert.Equal(PerChamber, Count(database, $"SELECT COUNT(DISTINCT s.seq) FROM samples s JOIN chambers c ON c.id = s.chamber_id JOIN channels h ON h.id = s.channel_id WHERE c.name = '{chamber}' AND h.name = 'substrate_tc'"));
                Assert.Equal(PerChamber - 1, Count(database, $"SELECT MAX(s.seq) FROM samples s JOIN chambers c ON c.id = s.chamber_id WHERE c.name = '{chamber}'"));
            }
            var runs = Rows(database, "SELECT c.name, r.end_reason, r.l_eff_nm, r.t_eff_c, r.coverage, r.excursions_json FROM runs r JOIN chambers c ON c.id = r.chamber_id ORDER BY c.name");
            Assert.Equal(3, runs.Count);
            Assert.All(runs, r => Assert.Equal("EndEvent", r[1]));
            Assert.Equal(runs[2][2..], runs[0][2..]);
            Assert.Equal(runs[2][2..], runs[1][2..]);
            var alerts = Rows(database, "SELECT chamber, kind, raised_us::text, state FROM alerts WHERE chamber IS NOT NULL ORDER BY chamber, kind, raised_us");
            output.WriteLine("alert records: " + string.Join("; ", alerts.Select(a => string.Join(' ', a))));
            foreach (var (name, daemon) in new[] { ("daemon-a", daemonA), ("daemon-b", daemonB) })
            {
                output.WriteLine(name + ": " + string.Join("\n  ", daemon.Output.Split('\n').Where(l => l.Contains("taken over", StringComparison.Ordinal)
                    || l.Contains("no longer owned", StringComparison.Ordinal) || l.Contains("Ownership check", StringComparison.Ordinal) || l.Contains("alert", StringComparison.OrdinalIgnoreCase))));
            }
            var control = alerts.Where(a => a[0] == "C3").Select(a => string.Join(' ', a.Skip(1))).ToList();
            Assert.NotEmpty(control);
            Assert.Equal(control, alerts.Where(a => a[0] == "C1").Select(a => string.Join(' ', a.Skip(1))));
            Assert.Equal(control, alerts.Where(a => a[0] == "C2").Select(a => string.Join(' ', a.Skip(1))));
        }
        finally
        {
            await postgres.DropDatabaseAsync(database);
            Directory.Delete(folderA, recursive: true);
            Directory.Delete(folderB, recursive: true);
        }
    }

    private static Dictionary<string, string> Settings(int brokerPort, string folder, string instance, string database, int maxOwned)
    {
        var settings = DaemonSettings.ForServe(brokerPort, folder, "runwatch-" + instance);
        settings["Broker:InstanceName"] = instance;
        settings["Storage:Provider"] = "PostgreSql";
        settings["Storage:ConnectionString"] = database;
        settings["Fleet:Enabled"] = "true";
        settings["Fleet:ClaimInterval"] = "00:00:00.250";
        settings["Fleet:MaxOwnedChambers"] = maxOwned.ToString(CultureInfo.InvariantCulture);
        // The stream's clock runs at 1 ms per sample, so an excursion of 400 samples lasts 0.4 s of sample time.
        settings["Chambers:0:Excursions:MinimumDuration"] = "00:00:00.100";
        for (int c = 1; c < Chambers.Length; c++)
        {
            // The same channels as the test chamber C1 of DaemonSettings, under other names.
            foreach (var (key, value) in settings.Where(kv => kv.Key.StartsWith("Chambers:0:", StringComparison.Ordinal)).ToList())
            {
                settings["Chambers:" + c.ToString(CultureInfo.InvariantCulture) + ":" + key["Chambers:0:".Length..]] = key == "Chambers:0:Name" ? Chambers[c] : value;
            }
        }
        return settings;
    }

    /// <summary>
    /// Sample times 1 ms apart from the test's start (the stream runs a little ahead of the clock, so no stale
    /// telemetry alarm); 610 °C with a small deterministic ripple, and two excursions of +80 K.
    /// </summary>
    private static byte[] Sample(DateTimeOffset start, int seq)
    {
        double tc = (seq is >= 2_000 and < 2_400) || (seq is >= 22_000 and < 22_400) ? 690 : 610 + (0.3 * Math.Sin(seq / 7.0));
        return Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
            $"{{\"t\":\"{start.AddMilliseconds(seq):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"seq\":{seq},\"values\":{{\"substrate_tc\":{tc:F3},\"substrate_sp\":610}}}}"));
    }

    private static byte[] Event(DateTimeOffset at, string type) => Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
        $"{{\"t\":\"{at.AddMilliseconds(type == "run-start" ? -1 : 0):yyyy-MM-ddTHH:mm:ss.fffZ}\",\"type\":\"{type}\",\"run\":\"R-FLEET\",\"setpoint_c\":610}}"));

    private static long Count(string database, string sql)
    {
        try
        {
            using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(database) { Pooling = false }.ConnectionString);
            connection.Open();
            using var command = new NpgsqlCommand(sql, connection);
            return command.ExecuteScalar() is { } value and not DBNull ? Convert.ToInt64(value, CultureInfo.InvariantCulture) : 0;
        }
        catch (PostgresException ex) when (ex.SqlState == PostgresErrorCodes.UndefinedTable)
        {
            return 0;
        }
    }

    private static List<string?[]> Rows(string database, string sql)
    {
        using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(database) { Pooling = false }.ConnectionString);
        connection.Open();
        using var command = new NpgsqlCommand(sql, connection);
        using var reader = command.ExecuteReader();
        var rows = new List<string?[]>();
        while (reader.Read())
        {
            var row = new string?[reader.FieldCount];
            for (int i = 0; i < row.Length; i++)
            {
                row[i] = reader.IsDBNull(i) ? null : Convert.ToString(reader.GetValue(i), CultureInfo.InvariantCulture);
            }
            rows.Add(row);
        }
        return rows;
    }
}
