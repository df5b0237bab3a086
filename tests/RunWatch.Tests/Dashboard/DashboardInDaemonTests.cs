using System.Net;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using MQTTnet;
using MQTTnet.Protocol;
using RunWatch.Hosting;
using RunWatch.Testing.Mqtt;
using RunWatch.Web.Data;
using RunWatch.Web.Hosting;
using RunWatch.Web.Security;
using Xunit;

namespace RunWatch.Tests.Dashboard;

/// <summary>The dashboard composed into the daemon's host: a real MQTT publish to the embedded broker reaches the dashboard's read model through the SQLite store.</summary>
public sealed class DashboardInDaemonTests : IAsyncLifetime
{
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-dash-daemon-").FullName;
    private WebApplication _app = default!;
    private int _brokerPort;
    private string _baseUrl = "";

    public async Task InitializeAsync()
    {
        _brokerPort = FreePort.Next();
        int webPort = FreePort.Next();
        _baseUrl = $"http://127.0.0.1:{webPort}";
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Development, ApplicationName = "runwatch" });
        builder.Configuration.AddInMemoryCollection(new Dictionary<string, string?>
        {
            ["Urls"] = _baseUrl,
            ["ChambersFile"] = Path.Combine(_folder, "none.json"),
            ["Storage:DataDirectory"] = _folder,
            ["Broker:Mode"] = "Embedded",
            ["Broker:Host"] = "127.0.0.1",
            ["Broker:Port"] = _brokerPort.ToString(System.Globalization.CultureInfo.InvariantCulture),
            ["Chambers:0:Name"] = "c1",
            ["Chambers:0:Site"] = "lab",
            ["Chambers:0:Channels:0:Name"] = "substrate_tc",
            ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
            ["Chambers:0:Channels:0:Unit"] = "degC",
            ["Chambers:0:Channels:1:Name"] = "substrate_sp",
            ["Chambers:0:Channels:1:Role"] = "Setpoint",
            ["Chambers:0:Channels:1:Unit"] = "degC",
        });
        builder.WebHost.UseStaticWebAssets();
        builder.AddRunWatchDaemon([]);
        builder.AddRunWatchDashboard();
        builder.Services.AddRunWatchDashboardStoreData();
        _app = builder.Build();
        _app.Services.GetRequiredService<UserDirectory>().AddWithPassword("eng", DashboardRoles.Engineer, "a-long-test-password");
        _app.MapRunWatchDaemon();
        _app.MapRunWatchDashboard();
        await _app.StartAsync();
    }

    public async Task DisposeAsync()
    {
        await _app.StopAsync();
        await _app.DisposeAsync();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    [Fact]
    public async Task MqttPublish_ToEmbeddedBroker_ReachesDashboardReadModelAndLoginPage()
    {
        // The daemon subscribes once connected; a message published before that would reach no subscriber.
        var health = _app.Services.GetRequiredService<RunWatch.Ingest.Health.IngestHealth>();
        var connectDeadline = DateTimeOffset.UtcNow.AddSeconds(30);
        while (health.Snapshot().BrokerState != RunWatch.Ingest.Health.BrokerConnectionState.Connected && DateTimeOffset.UtcNow < connectDeadline)
        {
            await Task.Delay(50);
        }
        Assert.Equal(RunWatch.Ingest.Health.BrokerConnectionState.Connected, health.Snapshot().BrokerState);
        var at = DateTimeOffset.UtcNow;
        using (var client = new MqttClientFactory().CreateMqttClient())
        {
            await client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", _brokerPort).WithClientId("dash-test-pub").Build());
            string payload = $"{{\"t\":\"{at:O}\",\"seq\":1,\"values\":{{\"substrate_tc\":612.3,\"substrate_sp\":610}}}}";
            await client.PublishAsync(new MqttApplicationMessageBuilder().WithTopic("runwatch/lab/c1/telemetry").WithPayload(payload)
                .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce).Build());
            await client.DisconnectAsync();
        }

        var queries = _app.Services.GetRequiredService<IDashboardQueries>();
        ChamberStatus? chamber = null;
        var deadline = DateTimeOffset.UtcNow.AddSeconds(20);
        while (DateTimeOffset.UtcNow < deadline)
        {
            chamber = await queries.GetChamberAsync("c1", CancellationToken.None);
            if (chamber?.Temperature is not null)
            {
                break;
            }
            await Task.Delay(100);
        }

        Assert.NotNull(chamber);
        Assert.Equal(612.3, chamber.Temperature);
        Assert.Equal(610, chamber.Setpoint);
        // The chart bands are the chamber's alert bands (Excursions defaults 5 K / 15 K), not the dashboard's fallback 3 K / 8 K.
        Assert.Equal(new TemperatureBands(5, 15), chamber.Bands);
        using var http = new HttpClient();
        var login = await http.GetAsync(_baseUrl + "/login");
        Assert.Equal(HttpStatusCode.OK, login.StatusCode);
        var api = await http.GetAsync(_baseUrl + "/api/chambers");
        Assert.Equal(HttpStatusCode.Unauthorized, api.StatusCode);
        var healthz = await http.GetAsync(_baseUrl + "/healthz");
        Assert.NotEqual(HttpStatusCode.NotFound, healthz.StatusCode);
    }
}
