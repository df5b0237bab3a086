using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Diagnostics.HealthChecks;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Prometheus;
using RunWatch.Ingest;
using RunWatch.Ingest.Health;
using Serilog;

namespace RunWatch.Hosting;

/// <summary>
/// Composition of the daemon in one ASP.NET Core host, shared by <c>runwatch serve</c> and <c>runwatch demo</c>:
/// configuration sources, Serilog, systemd integration, ingest with its hosted services, /healthz and /metrics.
/// The dashboard adds itself to the same builder and app.
/// </summary>
public static class DaemonComposition
{
    /// <summary>
    /// Adds the chamber file (<c>ChambersFile</c>, default config/chambers.json, optional) beneath environment variables
    /// and the command line, Serilog from the <c>Serilog</c> section, systemd notify/watchdog, the ingest services and
    /// health checks; Kestrel listens on <c>Urls</c> (default http://127.0.0.1:5080 from appsettings.json).
    /// </summary>
    public static WebApplicationBuilder AddRunWatchDaemon(this WebApplicationBuilder builder, string[] args)
    {
        ArgumentNullException.ThrowIfNull(builder);
        ArgumentNullException.ThrowIfNull(args);
        string chambersFile = builder.Configuration["ChambersFile"] ?? Path.Combine("config", "chambers.json");
        builder.Configuration.AddJsonFile(Path.GetFullPath(chambersFile), optional: true, reloadOnChange: false);
        // Keep the usual precedence: environment variables and the command line override every file.
        builder.Configuration.AddEnvironmentVariables();
        builder.Configuration.AddCommandLine(args);
        // Relative data and log paths never land in a source folder (RuntimeFolders); absolute ones stay as given.
        var absolute = new Dictionary<string, string?>(StringComparer.Ordinal);
        foreach (string key in (string[])["Storage:DataDirectory", "Serilog:WriteTo:1:Args:path"])
        {
            if (builder.Configuration[key] is { Length: > 0 } configured && !Path.IsPathRooted(configured))
            {
                absolute[key] = RuntimeFolders.Resolve(configured);
            }
        }
        builder.Configuration.AddInMemoryCollection(absolute);
        if (string.IsNullOrEmpty(builder.Configuration["Urls"]))
        {
            builder.WebHost.UseUrls("http://127.0.0.1:5080");
        }

        builder.Services.AddSerilog((services, logger) => logger
            .ReadFrom.Configuration(builder.Configuration)
            .ReadFrom.Services(services)
            .Enrich.FromLogContext());
        builder.Host.UseSystemd();
        if (Microsoft.Extensions.Hosting.Systemd.SystemdHelpers.IsSystemdService())
        {
            builder.Services.AddHostedService<SystemdWatchdogService>();
        }

        Metrics.SuppressDefaultMetrics();
        builder.Services.AddRunWatchIngest(builder.Configuration);
        // A dashboard in the same host draws each chamber's chart bands from the alert engine's own configuration.
        builder.Services.TryAddSingleton<RunWatch.Web.Data.IChamberBandSource, AlertEngineBandSource>();
        return builder;
    }

    /// <summary>Maps <c>/healthz</c> (JSON; 200 when healthy or degraded, 503 when unhealthy) and <c>/metrics</c> (Prometheus text).</summary>
    public static WebApplication MapRunWatchDaemon(this WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        app.MapHealthChecks("/healthz", new HealthCheckOptions
        {
            ResponseWriter = HealthResponseWriter.WriteAsync,
            ResultStatusCodes =
            {
                [HealthStatus.Healthy] = StatusCodes.Status200OK,
                [HealthStatus.Degraded] = StatusCodes.Status200OK,
                [HealthStatus.Unhealthy] = StatusCodes.Status503ServiceUnavailable,
            },
        });
        app.MapMetrics("/metrics");
        return app;
    }
}
