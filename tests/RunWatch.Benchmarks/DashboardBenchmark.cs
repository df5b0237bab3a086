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
using RunWatch.Testing.Dashboard;
using RunWatch.Web.Hosting;
using RunWatch.Web.Security;

namespace RunWatch.Benchmarks;

/// <summary>
/// Run page of a 10-hour run at 10 Hz (360,001 samples) in headless Chromium, over the real composition and its SQLite
/// store (the goal: under 2 s). Peers in the same run: the raw sample API on the same store (query + LTTB + JSON), the
/// same page over the in-memory data, and the in-memory page shipping 50,000 points instead of 5,000.
/// </summary>
internal sealed class DashboardBenchmark : IBenchmark
{
    private const string Password = "bench-password-1";
    private const double Hours = 10;

    public string Name => "dashboard";

    public string Description => "run page of a 10 h run at 10 Hz in Chromium over SQLite (goal < 2 s) vs the sample API and the in-memory page";

    public int Run(bool quick, TextWriter output) => RunAsync(quick, output).GetAwaiter().GetResult();

    private static async Task<int> RunAsync(bool quick, TextWriter output)
    {
        int repeats = quick ? 2 : 3;
        using var playwright = await Playwright.CreateAsync();
        string profile = Directory.CreateTempSubdirectory("runwatch-bench-chromium-").FullName;
        await using var context = await playwright.Chromium.LaunchPersistentContextAsync(profile, new BrowserTypeLaunchPersistentContextOptions
        {
            ExecutablePath = "/usr/bin/chromium",
            Headless = true,
            Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
            ViewportSize = new ViewportSize { Width = 1440, Height = 1000 },
        });

        double storePage;
        double storeApi;
        await using (var stored = await DashboardStoreHost.StartAsync(Hours, "bench", Password))
        {
            output.WriteLine($"   SQLite store: {stored.Samples:N0} samples ({Hours:F0} h at 10 Hz) written through the batch path in {stored.InsertTime.TotalSeconds:F1} s");
            var page = await LoginAsync(context, stored.BaseUrl);
            (storePage, string shipped) = await MeasureRunPageAsync(page, stored.BaseUrl, DashboardStoreHost.RunName, repeats);
            var apiTimes = new List<double>();
            for (int i = 0; i < repeats + 1; i++)
            {
                var clock = Stopwatch.StartNew();
                var response = await page.APIRequest.GetAsync($"{stored.BaseUrl}/api/runs/{DashboardStoreHost.RunName}/samples?maxPoints=5000");
                string body = await response.TextAsync();
                clock.Stop();
                if (response.Status != 200 || body.Length < 1000)
                {
                    throw new InvalidOperationException($"sample API answered {response.Status} with {body.Length} characters");
                }
                if (i > 0)
                {
                    apiTimes.Add(clock.Elapsed.TotalMilliseconds);
                }
            }
            storeApi = Median(apiTimes);
            await page.CloseAsync();
            output.WriteLine($"   store: run page load to drawn chart median {storePage,7:F0} ms over {repeats} loads (goal < 2000 ms), points shipped {shipped}");
            output.WriteLine($"   store: GET /api/runs/{{id}}/samples?maxPoints=5000 median {storeApi,7:F0} ms (query + LTTB + JSON, no browser)");
        }

        var data = new InMemoryDashboardData(TimeProvider.System);
        InventedLabScenario.Seed(data, DateTimeOffset.UtcNow, sampleRateHz: 10, endedRunHours: Hours);
        var run = (await data.GetRunAsync(InventedLabScenario.EndedRun, CancellationToken.None))!;
        var query = Stopwatch.StartNew();
        var samples = await data.GetSamplesAsync(run.Summary.Chamber, run.TemperatureChannel, run.Summary.Start, run.Summary.End!.Value, CancellationToken.None);
        query.Stop();
        var lttb = Stopwatch.StartNew();
        var indices = new int[5000];
        Lttb.SelectIndices(samples.UnixSeconds, samples.Values, indices);
        lttb.Stop();
        output.WriteLine($"   in-memory: {samples.UnixSeconds.Length:N0} samples; query {query.Elapsed.TotalMilliseconds:F1} ms, LTTB to 5,000 points {lttb.Elapsed.TotalMilliseconds:F1} ms");
        var memory = new List<double>();
        foreach (int maxPoints in new[] { 5000, 50_000 })
        {
            await using var app = await StartAsync(data, maxPoints);
            string baseUrl = app.Urls.First();
            var page = await LoginAsync(context, baseUrl);
            var (median, shipped) = await MeasureRunPageAsync(page, baseUrl, InventedLabScenario.EndedRun, repeats);
            await page.CloseAsync();
            memory.Add(median);
            output.WriteLine($"   in-memory, cap {maxPoints,6:N0}: run page load to drawn chart median {median,7:F0} ms, points shipped {shipped}");
        }
        output.WriteLine($"   ratio store page / sample API on the same store = {storePage / storeApi:F1}");
        output.WriteLine($"   ratio store page / in-memory page (same 5,000-point cap) = {storePage / memory[0]:F2}");
        output.WriteLine($"   ratio in-memory page 50,000 points / 5,000 LTTB points = {memory[1] / memory[0]:F2}");
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

    private static async Task<IPage> LoginAsync(IBrowserContext context, string baseUrl)
    {
        await context.ClearCookiesAsync();
        var page = await context.NewPageAsync();
        await page.GotoAsync(baseUrl + "/login");
        await page.FillAsync("input[name=username]", "bench");
        await page.FillAsync("input[name=password]", Password);
        await page.ClickAsync("button[type=submit]");
        await page.WaitForSelectorAsync("[data-testid=who]");
        return page;
    }

    /// <summary>Median time from navigation to the drawn chart line over <paramref name="repeats"/> loads after one warm-up.</summary>
    private static async Task<(double MedianMs, string Shipped)> MeasureRunPageAsync(IPage page, string baseUrl, string run, int repeats)
    {
        var times = new List<double>();
        string shipped = "";
        for (int i = 0; i < repeats + 1; i++)
        {
            var clock = Stopwatch.StartNew();
            await page.GotoAsync(baseUrl + "/runs/" + run);
            await page.WaitForSelectorAsync("#run-chart .scatterlayer .trace path.js-line", new() { Timeout = 120_000 });
            clock.Stop();
            shipped = await page.GetAttributeAsync("[data-testid=run-chart]", "data-points") ?? "?";
            if (i > 0)
            {
                times.Add(clock.Elapsed.TotalMilliseconds);
            }
        }
        return (Median(times), shipped);
    }

    private static double Median(List<double> values)
    {
        values.Sort();
        return values.Count % 2 == 1 ? values[values.Count / 2] : (values[values.Count / 2 - 1] + values[values.Count / 2]) / 2;
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
        builder.Services.AddSingleton<IPlannerEngine>(new RunWatch.Web.Data.Store.ProcessModelPlanner(Microsoft.Extensions.Options.Options.Create(new RunWatch.Web.DashboardOptions())));
        var app = builder.Build();
        app.Services.GetRequiredService<UserDirectory>().AddWithPassword("bench", DashboardRoles.Viewer, Password);
        app.MapRunWatchDashboard();
        await app.StartAsync();
        return app;
    }
}
