using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Prometheus;
using RunWatch.Ingest.Health;

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

    public static Dictionary<string, string?> Settings(int brokerPort, string folder) => new()
    {
        ["Broker:Mode"] = "External",
        ["Broker:Host"] = "127.0.0.1",
        ["Broker:Port"] = brokerPort.ToString(System.Globalization.CultureInfo.InvariantCulture),
        ["Broker:ClientId"] = "runwatch-test-" + Path.GetFileName(folder),
        ["Broker:ReconnectInitialDelay"] = "00:00:00.200",
        ["Broker:ReconnectMaxDelay"] = "00:00:01",
        ["Storage:DataDirectory"] = folder,
        ["Storage:Synchronous"] = "Normal",
        ["Chambers:0:Name"] = "C1",
        ["Chambers:0:Site"] = "lab",
        ["Chambers:0:Channels:0:Name"] = "substrate_tc",
        ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
        ["Chambers:0:Channels:0:Unit"] = "degC",
        ["Chambers:0:Channels:0:Min"] = "-50",
        ["Chambers:0:Channels:0:Max"] = "1200",
        ["Chambers:0:Channels:1:Name"] = "substrate_sp",
        ["Chambers:0:Channels:1:Role"] = "Setpoint",
        ["Chambers:0:Channels:1:Unit"] = "degC",
        ["Chambers:0:Channels:2:Name"] = "ga_shutter",
        ["Chambers:0:Channels:2:Role"] = "GrowthShutter",
        ["Chambers:0:Channels:2:Unit"] = "1",
    };

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
