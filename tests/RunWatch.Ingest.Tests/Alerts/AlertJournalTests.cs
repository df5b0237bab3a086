using System.Collections.Concurrent;
using System.Globalization;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Prometheus;
using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Health;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Alerts;

/// <summary>
/// An alert published while the store cannot be written is not lost when the daemon stops before the store is back:
/// the change was journalled on disk before it was published and is stored at the next start.
/// </summary>
public sealed class AlertJournalTests
{
    [Fact]
    public async Task Dispatch_StoreDownAndDaemonStoppedBeforeRecovery_PublishedAlertStoredAtNextStart()
    {
        await using var broker = await MosquittoBroker.StartAsync();
        string folder = Directory.CreateTempSubdirectory("runwatch-journal-").FullName;
        try
        {
            var published = new ConcurrentQueue<string>();
            bool outage = false;
            using (var first = await StartAsync(broker.Port, folder, () => outage, published))
            {
                outage = true;
                string t = DateTimeOffset.UtcNow.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture);
                await MosquittoClients.PublishAsync(broker.Port, "runwatch/lab/C1/telemetry", "{\"t\":\"" + t + "\",\"values\":{\"substrate_tc\":600}}", "journal-pub");
                await Poll.UntilAsync(() => published.Contains(AlertKinds.StoreUnwritable + ":raised"), TimeSpan.FromSeconds(20), "store-unwritable published");
                Assert.Equal(0, Count(folder, "SELECT COUNT(*) FROM alerts"));
                Assert.True(File.Exists(Path.Combine(folder, AlertJournal.FileName)), "the published change is not on disk");
                // Stopped while the store is still down: whatever was only in memory is gone, as after SIGKILL.
                await first.StopAsync();
            }
            SqliteConnection.ClearAllPools();

            using (var second = await StartAsync(broker.Port, folder, () => false, new ConcurrentQueue<string>()))
            {
                await Poll.UntilAsync(() => Count(folder, "SELECT COUNT(*) FROM alerts WHERE kind = 'store-unwritable'") == 1, TimeSpan.FromSeconds(20), "journalled alert stored");
                await Poll.UntilAsync(() => !File.Exists(Path.Combine(folder, AlertJournal.FileName)), TimeSpan.FromSeconds(10), "journal emptied once stored");
                await second.StopAsync();
            }
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void ReadPending_TornLastLine_SkippedAndNewestPerKeyKept()
    {
        string path = Path.GetTempFileName();
        try
        {
            var journal = new AlertJournal(path);
            var raised = new AlertRecord { Key = "k1", Kind = "stale-telemetry", State = AlertState.Unacknowledged, Message = "m", RaisedAt = DateTimeOffset.UnixEpoch, UpdatedAt = DateTimeOffset.UnixEpoch };
            Assert.True(journal.TryAppend(raised));
            Assert.True(journal.TryAppend(raised with { State = AlertState.ReturnedUnacknowledged }));
            File.AppendAllText(path, "{\"key\":\"k2\",\"kin");

            var pending = journal.ReadPending();

            var only = Assert.Single(pending);
            Assert.Equal(AlertState.ReturnedUnacknowledged, only.State);
        }
        finally
        {
            File.Delete(path);
        }
    }

    private static async Task<IHost> StartAsync(int port, string folder, Func<bool> outage, ConcurrentQueue<string> published)
    {
        var builder = Host.CreateApplicationBuilder();
        builder.Configuration.AddInMemoryCollection(DaemonSettings.ForTestChamber(port, folder));
        builder.Services.AddSingleton(Metrics.NewCustomRegistry());
        builder.Services.AddSingleton<IRunWatchStore>(sp => StoreOutageProxy.Wrap(sp.GetRequiredService<SqliteRunWatchStore>(), outage));
        builder.Services.AddSingleton<IAlertListener>(new Recorder(published));
        builder.Services.AddRunWatchIngest(builder.Configuration);
        var host = builder.Build();
        await host.StartAsync();
        var health = host.Services.GetRequiredService<IngestHealth>();
        await Poll.UntilAsync(() => health.Snapshot().BrokerState == BrokerConnectionState.Connected, TimeSpan.FromSeconds(20), "connected");
        return host;
    }

    private static long Count(string folder, string sql) => InProcessDaemon.SqliteScalar(Path.Combine(folder, "runwatch.db"), sql);

    private sealed class Recorder(ConcurrentQueue<string> published) : IAlertListener
    {
        public void AlertChanged(AlertRecord alert, string change) => published.Enqueue(alert.Kind + ":" + change);
    }
}
