using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Prometheus;
using RunWatch.Ingest.Health;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Support;

/// <summary>The ingest services in a generic host inside the test process, against an external broker and a temp SQLite file.</summary>
internal sealed class InProcessDaemon : IAsyncDisposable
{
    private readonly IHost _host;

    private InProcessDaemon(IHost host, string folder)
    {
        _host = host;
        Folder = folder;
    }

    public string Folder { get; }

    public string DatabasePath => Path.Combine(Folder, "runwatch.db");

    public IServiceProvider Services => _host.Services;

    public IngestHealth Health => _host.Services.GetRequiredService<IngestHealth>();

    public static Dictionary<string, string?> Settings(int brokerPort, string folder) => DaemonSettings.ForTestChamber(brokerPort, folder);

    public static async Task<InProcessDaemon> StartAsync(int brokerPort, Action<Dictionary<string, string?>>? configure = null)
    {
        string folder = Directory.CreateTempSubdirectory("runwatch-daemon-").FullName;
        var settings = Settings(brokerPort, folder);
        configure?.Invoke(settings);
        var builder = Host.CreateApplicationBuilder();
        builder.Configuration.AddInMemoryCollection(settings);
        builder.Services.AddSingleton(Metrics.NewCustomRegistry());
        builder.Services.AddRunWatchIngest(builder.Configuration);
        var host = builder.Build();
        await host.StartAsync().ConfigureAwait(false);
        var daemon = new InProcessDaemon(host, folder);
        await Poll.UntilAsync(() => daemon.Health.Snapshot().BrokerState == BrokerConnectionState.Connected, TimeSpan.FromSeconds(20), "daemon connected").ConfigureAwait(false);
        return daemon;
    }

    public long Scalar(string sql) => SqliteScalar(DatabasePath, sql);

    public static long SqliteScalar(string databasePath, string sql)
    {
        using var connection = new SqliteConnection("Data Source=" + databasePath + ";Mode=ReadOnly;Pooling=False");
        connection.Open();
        using var command = connection.CreateCommand();
        command.CommandText = sql;
        return (long)command.ExecuteScalar()!;
    }

    public async ValueTask DisposeAsync()
    {
        await _host.StopAsync().ConfigureAwait(false);
        _host.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(Folder, recursive: true);
    }
}
