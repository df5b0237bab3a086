using System.Net;
using System.Net.Sockets;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Hosting;
using RunWatch.Web.Live;
using RunWatch.Web.Security;

namespace RunWatch.Tests.Dashboard;

/// <summary>The dashboard on a free loopback port over the invented in-memory lab, with one user per role.</summary>
internal sealed class DashboardTestHost : IAsyncDisposable
{
    public const string Password = "correct-horse-battery";

    private DashboardTestHost(WebApplication app, InMemoryDashboardData data, string baseUrl)
    {
        App = app;
        Data = data;
        BaseUrl = baseUrl;
    }

    public WebApplication App { get; }

    public InMemoryDashboardData Data { get; }

    public string BaseUrl { get; }

    public ITelemetryNotifier Notifier => App.Services.GetRequiredService<ITelemetryNotifier>();

    public static async Task<DashboardTestHost> StartAsync(Action<InMemoryDashboardData>? seed = null)
    {
        int port = FreePort();
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions
        {
            EnvironmentName = Environments.Development,
            // The test output carries the runwatch executable's static web asset manifests (plotly.js, the stylesheet).
            ApplicationName = "runwatch",
        });
        builder.WebHost.UseUrls($"http://127.0.0.1:{port}");
        builder.WebHost.UseStaticWebAssets();
        builder.Logging.ClearProviders();
        builder.AddRunWatchDashboard();
        var data = new InMemoryDashboardData(TimeProvider.System);
        if (seed is null)
        {
            InventedLabScenario.Seed(data, DateTimeOffset.UtcNow);
        }
        else
        {
            seed(data);
        }
        builder.Services.AddSingleton<IDashboardQueries>(data);
        builder.Services.AddSingleton<IDashboardCommands>(data);
        builder.Services.AddSingleton<ILabRecordQueries>(new InMemoryLabRecords());
        builder.Services.AddSingleton<IPlannerEngine>(new RunWatch.Web.Data.Store.ProcessModelPlanner(Microsoft.Extensions.Options.Options.Create(new RunWatch.Web.DashboardOptions())));
        var app = builder.Build();
        var users = app.Services.GetRequiredService<UserDirectory>();
        foreach (var role in DashboardRoles.All)
        {
            users.AddWithPassword("test-" + role, role, Password);
        }
        app.MapRunWatchDashboard();
        await app.StartAsync();
        return new DashboardTestHost(app, data, $"http://127.0.0.1:{port}");
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    public async ValueTask DisposeAsync()
    {
        await App.StopAsync();
        await App.DisposeAsync();
    }
}
