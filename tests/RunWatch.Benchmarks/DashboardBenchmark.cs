using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Playwright;
using RunWatch.Core.Charting;
using RunWatch.Web.Data;
using RunWatch.Web.Data.InMemory;
using RunWatch.Web.Hosting;
using RunWatch.Web.Security;

namespace RunWatch.Benchmarks;

/// <summary>
/// Run page of a 10-hour run at 10 Hz (360,000 samples) in headless Chromium: load time and points shipped with
/// LTTB at 5,000 points, against the same page shipping 50,000 points, and against the bare sample query and LTTB.
/// </summary>
internal sealed class DashboardBenchmark : IBenchmark
{
    private const string Password = "bench-password-1";

    public string Name => "dashboard";

    public string Description => "run page of a 10 h run at 10 Hz in Chromium: LTTB 5,000 points vs 50,000 points shipped";

    public int Run(bool quick, TextWriter output) => RunAsync(quick, output).GetAwaiter().GetResult();

    private static async Task<int> RunAsync(bool quick, TextWriter output)
    {
        double hours = quick ? 2 : 10;
        int repeats = quick ? 2 : 3;
        var now = DateTimeOffset.UtcNow;
        var data = new InMemoryDashboardData(TimeProvider.System);
        InventedLabScenario.Seed(data, now, sampleRateHz: 10, endedRunHours: hours);
        var run = (await data.GetRunAsync(InventedLabScenario.EndedRun, CancellationToken.None))!;

        // Peer 1: the query and the downsampling alone, no browser.
        var query = Stopwatch.StartNew();
        var samples = await data.GetSamplesAsync(run.Summary.Chamber, run.TemperatureChannel, run.Summary.Start, run.Summary.End!.Value, CancellationToken.None);
        query.Stop();
        var lttb = Stopwatch.StartNew();
        var indices = new int[5000];
        Lttb.SelectIndices(samples.UnixSeconds, samples.Values, indices);
        lttb.Stop();
        output.WriteLine($"   samples in run: {samples.UnixSeconds.Length:N0} ({hours:F0} h at 10 Hz)");
        output.WriteLine($"   query {query.Elapsed.TotalMilliseconds:F1} ms, LTTB to 5,000 points {lttb.Elapsed.TotalMilliseconds:F1} ms");

        using var playwright = await Playwright.CreateAsync();
        string profile = Directory.CreateTempSubdirectory("runwatch-bench-chromium-").FullName;
        await using var context = await playwright.Chromium.LaunchPersistentContextAsync(profile, new BrowserTypeLaunchPersistentContextOptions
        {
            ExecutablePath = "/usr/bin/chromium",
            Headless = true,
            Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
            ViewportSize = new ViewportSize { Width = 1440, Height = 1000 },
        });
        var results = new List<(int MaxPoints, double Median, string Shipped)>();
        foreach (int maxPoints in new[] { 5000, 50_000 })
        {
            await using var app = await StartAsync(data, maxPoints);
            string baseUrl = app.Urls.First();
            await context.ClearCookiesAsync();
            var page = await context.NewPageAsync();
            await page.GotoAsync(baseUrl + "/login");
            await page.FillAsync("input[name=username]", "bench");
            await page.FillAsync("input[name=password]", Password);
            await page.ClickAsync("button[type=submit]");
            await page.WaitForSelectorAsync("[data-testid=who]");
            var times = new List<double>();
            string shipped = "";
            for (int i = 0; i < repeats + 1; i++)
            {
                var clock = Stopwatch.StartNew();
                await page.GotoAsync(baseUrl + "/runs/" + InventedLabScenario.EndedRun);
                await page.WaitForSelectorAsync("#run-chart .scatterlayer .trace path.js-line", new() { Timeout = 120_000 });
                clock.Stop();
                shipped = await page.GetAttributeAsync("[data-testid=run-chart]", "data-points") ?? "?";
                if (i > 0)
                {
                    times.Add(clock.Elapsed.TotalMilliseconds);
                }
            }
            await page.CloseAsync();
            times.Sort();
            results.Add((maxPoints, times[times.Count / 2], shipped));
            output.WriteLine($"   cap {maxPoints,6:N0}: page load to drawn chart median {times[times.Count / 2],7:F0} ms over {times.Count} loads, points shipped {shipped}");
        }
        output.WriteLine($"   ratio load(50,000 points) / load(5,000 LTTB points) = {results[1].Median / results[0].Median:F2}");
        output.WriteLine($"   ratio load(5,000 LTTB points) / (query + LTTB) = {results[0].Median / (query.Elapsed.TotalMilliseconds + lttb.Elapsed.TotalMilliseconds):F1}");
        try
        {
            Directory.Delete(profile, recursive: true);
        }
        catch (IOException)
        {
            // Chromium may hold its lock file a moment longer; the OS cleans temp folders.
        }
        return 0;
    }

    private static async Task<WebApplication> StartAsync(InMemoryDashboardData data, int maxPoints)
    {
        int port;
        using (var listener = new TcpListener(IPAddress.Loopback, 0))
        {
            listener.Start();
            port = ((IPEndPoint)listener.LocalEndpoint).Port;
        }
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Development, ApplicationName = "runwatch" });
        builder.WebHost.UseUrls($"http://127.0.0.1:{port}");
        builder.WebHost.UseStaticWebAssets();
        builder.Logging.ClearProviders();
        builder.Configuration["RunWatch:Dashboard:MaxChartPoints"] = maxPoints.ToString(System.Globalization.CultureInfo.InvariantCulture);
        builder.AddRunWatchDashboard();
        builder.Services.AddSingleton<IDashboardQueries>(data);
        builder.Services.AddSingleton<IDashboardCommands>(data);
        builder.Services.AddSingleton<IPlannerEngine>(new ScenarioPlanner());
        var app = builder.Build();
        app.Services.GetRequiredService<UserDirectory>().AddWithPassword("bench", DashboardRoles.Viewer, Password);
        app.MapRunWatchDashboard();
        await app.StartAsync();
        return app;
    }
}
