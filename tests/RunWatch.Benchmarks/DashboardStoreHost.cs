using System.Globalization;
using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Hosting;
using RunWatch.Storage;
using RunWatch.Testing.Mqtt;
using RunWatch.Web.Security;

namespace RunWatch.Benchmarks;

/// <summary>
/// The program's own composition (<see cref="RunWatchComposition.AddRunWatch"/>, as <c>runwatch serve</c> builds it)
/// over a temp SQLite store holding one closed run of <c>hours</c> at 10 Hz, written through the store's batch path.
/// </summary>
internal sealed class DashboardStoreHost : IAsyncDisposable
{
    public const string Chamber = "bench-1";
    public const string RunName = "R-BENCH-LONG";
    private const string Channel = "substrate_tc";

    private readonly string _folder;

    private DashboardStoreHost(WebApplication app, string folder, int samples, TimeSpan insert)
    {
        App = app;
        _folder = folder;
        Samples = samples;
        InsertTime = insert;
    }

    public WebApplication App { get; }

    public string BaseUrl => App.Urls.First();

    public int Samples { get; }

    public TimeSpan InsertTime { get; }

    public static async Task<DashboardStoreHost> StartAsync(double hours, string user, string password)
    {
        string folder = Directory.CreateTempSubdirectory("runwatch-bench-store-").FullName;
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Production, ApplicationName = "runwatch" });
        builder.Configuration.AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["Urls"] = "http://127.0.0.1:" + FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["ChambersFile"] = Path.Combine(folder, "none.json"),
            ["Storage:DataDirectory"] = folder,
            ["Broker:Mode"] = "Embedded",
            ["Broker:Host"] = "127.0.0.1",
            ["Broker:Port"] = FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["Serilog:MinimumLevel:Default"] = "Warning",
            ["Chambers:0:Name"] = Chamber,
            ["Chambers:0:Site"] = "lab",
            ["Chambers:0:Channels:0:Name"] = Channel,
            ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
            ["Chambers:0:Channels:0:Unit"] = "degC",
            ["Chambers:0:Channels:1:Name"] = "substrate_sp",
            ["Chambers:0:Channels:1:Role"] = "Setpoint",
            ["Chambers:0:Channels:1:Unit"] = "degC",
        });
        builder.AddRunWatch([]);
        var app = builder.Build();
        app.Services.GetRequiredService<UserDirectory>().AddWithPassword(user, DashboardRoles.Viewer, password);
        app.MapRunWatch();
        await app.StartAsync();

        var store = app.Services.GetRequiredService<IRunWatchStore>();
        RegisteredChannel channel = await WaitForChannelAsync(store);
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var end = DateTimeOffset.UtcNow;
        var start = end - TimeSpan.FromHours(hours);
        int count = (int)Math.Round(hours * 3600 * 10) + 1;
        long startUs = start.ToUnixTimeMilliseconds() * 1000;
        var batch = new IngestBatch(10_000);
        var random = new Random(20260312);
        for (int i = 0; i < count; i++)
        {
            // Invented record: a slow drift around 610 °C with noise, one sample every 100 ms.
            double value = 610 + 1.5 * Math.Sin(i / 20_000.0) + 0.3 * (random.NextDouble() - 0.5);
            batch.AddSample(new SampleRow(channel.ChamberId, channel.ChannelId, startUs + i * 100_000L, i, value));
            if (batch.SampleCount == 10_000 || i == count - 1)
            {
                await store.WriteBatchAsync(batch, CancellationToken.None);
                batch.Clear();
            }
        }
        clock.Stop();
        await store.SaveRunAsync(new RunRecord
        {
            Chamber = Chamber,
            Name = RunName,
            Status = RunStatus.Closed,
            Recipe = "bench-recipe",
            SetpointC = 610,
            PlannedSeconds = hours * 3600,
            StartedAt = start,
            EndedAt = end.AddMilliseconds(1),
            LastSampleAt = end,
            LNomNm = 300,
            LEffNm = 301,
            TEffC = 610.1,
            Coverage = 1,
        }, CancellationToken.None);
        return new DashboardStoreHost(app, folder, count, clock.Elapsed);
    }

    private static async Task<RegisteredChannel> WaitForChannelAsync(IRunWatchStore store)
    {
        var deadline = DateTime.UtcNow.AddSeconds(30);
        while (true)
        {
            var chambers = await store.ListChambersAsync(CancellationToken.None);
            var channel = chambers.SelectMany(c => c.Channels).FirstOrDefault(c => c.Definition.Name == Channel);
            if (channel is not null)
            {
                return channel;
            }
            if (DateTime.UtcNow > deadline)
            {
                throw new TimeoutException("the daemon did not register the benchmark chamber within 30 s");
            }
            await Task.Delay(50);
        }
    }

    public async ValueTask DisposeAsync()
    {
        await App.StopAsync();
        await App.DisposeAsync();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }
}
