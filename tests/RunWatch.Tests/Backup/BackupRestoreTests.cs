using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Backup;
using RunWatch.Hosting;
using RunWatch.Ingest.Health;
using RunWatch.Testing.Mqtt;
using Xunit;

namespace RunWatch.Tests.Backup;

/// <summary>
/// Backs up a running daemon while telemetry is being ingested, restores into a fresh data folder, starts a daemon on
/// it, and compares every table and file with the original.
/// </summary>
public sealed class BackupRestoreTests : IDisposable
{
    private readonly string _live = Directory.CreateTempSubdirectory("runwatch-backup-live-").FullName;
    private readonly string _restored = Path.Combine(Path.GetTempPath(), "runwatch-backup-restored-" + Guid.NewGuid().ToString("N"));
    private readonly string _archive = Path.Combine(Path.GetTempPath(), "runwatch-backup-" + Guid.NewGuid().ToString("N") + ".tar");

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_live, recursive: true);
        if (Directory.Exists(_restored))
        {
            Directory.Delete(_restored, recursive: true);
        }
        File.Delete(_archive);
    }

    [Fact]
    public async Task BackupWhileIngesting_RestoreIntoFreshFolder_EveryTableAndFileMatches()
    {
        int brokerPort = FreePort.Next();
        // Files beside the database, as reports, overlays and the drop folder leave them (invented content).
        Directory.CreateDirectory(Path.Combine(_live, "reports", "W-INV-1"));
        await File.WriteAllTextAsync(Path.Combine(_live, "reports", "W-INV-1", "report.html"), "<html>invented report</html>");
        Directory.CreateDirectory(Path.Combine(_live, "drop"));
        await File.WriteAllBytesAsync(Path.Combine(_live, "drop", "W-INV-1_f1.png"), RandomNumberGenerator.GetBytes(50_000));

        await using (var daemon = await StartAsync(_live, brokerPort))
        {
            var publisher = await MqttTestPublisher.ConnectAsync(brokerPort, "backup-publisher");
            using var stop = new CancellationTokenSource();
            var ingest = Task.Run(async () =>
            {
                int seq = 0;
                while (!stop.IsCancellationRequested)
                {
                    await publisher.PublishManyAsync("runwatch/lab/c1/telemetry", seq, 200, Telemetry);
                    seq += 200;
                }
            });
            var health = daemon.Services.GetRequiredService<IngestHealth>();
            var deadline = DateTime.UtcNow.AddSeconds(30);
            while (health.Snapshot().CommittedMessages < 500 && DateTime.UtcNow < deadline)
            {
                await Task.Delay(50);
            }

            var manifest = DataArchive.Create(_live, "runwatch.db", _archive, DateTimeOffset.UtcNow); // while ingest goes on

            await stop.CancelAsync();
            await ingest;
            // The publisher leaves before the daemon's embedded broker stops; disconnecting from a stopped broker races its socket close.
            await publisher.DisposeAsync();
            await daemon.StopAsync();
            Assert.Contains(manifest.Files, f => f.Path == "drop/W-INV-1_f1.png");
        }
        SqliteConnection.ClearAllPools();

        DataArchive.Restore(_archive, _restored);
        Assert.Throws<InvalidOperationException>(() => DataArchive.Restore(_archive, _restored)); // never over existing data

        string restoredDb = Path.Combine(_restored, "runwatch.db");
        Assert.Equal("ok", Scalar(restoredDb, "PRAGMA integrity_check"));
        long samples = Convert.ToInt64(Scalar(restoredDb, "SELECT COUNT(*) FROM samples"), CultureInfo.InvariantCulture);
        Assert.True(samples >= 500, "the backup holds " + samples + " samples");
        // Every table: each row of the backup is a row of the live database (which only grew after the backup).
        using (var connection = new SqliteConnection("Data Source=" + restoredDb + ";Pooling=False"))
        {
            connection.Open();
            using var attach = connection.CreateCommand();
            attach.CommandText = "ATTACH DATABASE $live AS live";
            attach.Parameters.AddWithValue("$live", Path.Combine(_live, "runwatch.db"));
            attach.ExecuteNonQuery();
            var tables = new List<string>();
            using (var list = connection.CreateCommand())
            {
                list.CommandText = "SELECT name FROM main.sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'";
                using var reader = list.ExecuteReader();
                while (reader.Read())
                {
                    tables.Add(reader.GetString(0));
                }
            }
            Assert.Contains("samples", tables);
            foreach (string table in tables)
            {
                using var missing = connection.CreateCommand();
                missing.CommandText = $"SELECT COUNT(*) FROM (SELECT * FROM main.\"{table}\" EXCEPT SELECT * FROM live.\"{table}\")";
                Assert.True((long)missing.ExecuteScalar()! == 0, "table " + table + " has rows the live database does not have");
            }
        }
        foreach (string relative in new[] { "reports/W-INV-1/report.html", "drop/W-INV-1_f1.png" })
        {
            Assert.Equal(await File.ReadAllBytesAsync(Path.Combine(_live, relative)), await File.ReadAllBytesAsync(Path.Combine(_restored, relative)));
        }

        // A fresh daemon opens the restored folder and sees the restored samples.
        SqliteConnection.ClearAllPools();
        await using (var fresh = await StartAsync(_restored, FreePort.Next()))
        {
            await fresh.StopAsync();
        }
        SqliteConnection.ClearAllPools();
        Assert.Equal(samples, Convert.ToInt64(Scalar(restoredDb, "SELECT COUNT(*) FROM samples"), CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Restore_TamperedArchive_RefusedNamingTheFile()
    {
        Directory.CreateDirectory(Path.Combine(_live, "reports"));
        File.WriteAllText(Path.Combine(_live, "reports", "a.txt"), "invented report text");
        using (var db = new SqliteConnection("Data Source=" + Path.Combine(_live, "runwatch.db") + ";Pooling=False"))
        {
            db.Open();
            using var create = db.CreateCommand();
            create.CommandText = "CREATE TABLE t (x INTEGER); INSERT INTO t VALUES (1);";
            create.ExecuteNonQuery();
        }
        DataArchive.Create(_live, "runwatch.db", _archive, DateTimeOffset.UnixEpoch);
        byte[] bytes = File.ReadAllBytes(_archive);
        int at = IndexOf(bytes, Encoding.ASCII.GetBytes("invented report text"));
        bytes[at] ^= 0x20;
        File.WriteAllBytes(_archive, bytes);

        var error = Assert.Throws<InvalidOperationException>(() => DataArchive.Restore(_archive, _restored));
        Assert.Contains("reports/a.txt", error.Message, StringComparison.Ordinal);
    }

    private static int IndexOf(byte[] haystack, byte[] needle)
    {
        for (int i = 0; i + needle.Length <= haystack.Length; i++)
        {
            if (haystack.AsSpan(i, needle.Length).SequenceEqual(needle))
            {
                return i;
            }
        }
        return -1;
    }

    private static byte[] Telemetry(int seq) => Encoding.UTF8.GetBytes(
        "{\"t\":\"" + DateTimeOffset.UtcNow.ToString("yyyy-MM-ddTHH:mm:ss.ffffffZ", CultureInfo.InvariantCulture) + "\",\"seq\":" + seq.ToString(CultureInfo.InvariantCulture)
        + ",\"values\":{\"substrate_tc\":" + (600 + (seq % 7)).ToString(CultureInfo.InvariantCulture) + "}}");

    private static object Scalar(string database, string sql)
    {
        using var connection = new SqliteConnection("Data Source=" + database + ";Mode=ReadOnly;Pooling=False");
        connection.Open();
        using var command = connection.CreateCommand();
        command.CommandText = sql;
        return command.ExecuteScalar()!;
    }

    private static async Task<WebApplication> StartAsync(string folder, int brokerPort)
    {
        var settings = new Dictionary<string, string?>
        {
            ["Urls"] = "http://127.0.0.1:" + FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["ChambersFile"] = Path.Combine(folder, "none.json"),
            ["Storage:DataDirectory"] = folder,
            ["Broker:Mode"] = "Embedded",
            ["Broker:Host"] = "127.0.0.1",
            ["Broker:Port"] = brokerPort.ToString(CultureInfo.InvariantCulture),
            ["Chambers:0:Name"] = "c1",
            ["Chambers:0:Site"] = "lab",
            ["Chambers:0:Channels:0:Name"] = "substrate_tc",
            ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
            ["Chambers:0:Channels:0:Unit"] = "degC",
        };
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Development, ApplicationName = "runwatch" });
        builder.Configuration.AddInMemoryCollection(settings);
        builder.AddRunWatch([]);
        var app = builder.Build();
        app.MapRunWatch();
        await app.StartAsync();
        var health = app.Services.GetRequiredService<IngestHealth>();
        var deadline = DateTime.UtcNow.AddSeconds(30);
        while (health.Snapshot().BrokerState != BrokerConnectionState.Connected && DateTime.UtcNow < deadline)
        {
            await Task.Delay(50);
        }
        return app;
    }
}
