using System.Diagnostics;
using Microsoft.Playwright;
using RunWatch.Web.Data;
using RunWatch.Testing.Dashboard;
using Xunit;

namespace RunWatch.Tests.Dashboard;

public sealed class DashboardBrowserTests(BrowserFixture fixture, Xunit.Abstractions.ITestOutputHelper output) : IClassFixture<BrowserFixture>
{
    private static readonly LocatorAssertionsToBeVisibleOptions Soon = new() { Timeout = 15_000 };

    [Fact]
    public async Task Overview_AfterCommittedSample_ShowsNewValueWithoutReload()
    {
        var page = await fixture.LoginAsync("test-engineer");
        var card = page.Locator("[data-chamber=north-1] [data-testid=temperature]");
        await Assertions.Expect(card).ToBeVisibleAsync(Soon);
        await fixture.ScreenshotAsync(page, "overview");

        var at = DateTimeOffset.UtcNow;
        fixture.Host.Data.AddSamples(InventedLabScenario.GrowingChamber, InventedLabScenario.TemperatureChannel, at, 633.3);
        var clock = Stopwatch.StartNew();
        fixture.Host.Notifier.SamplesCommitted([new LiveSample(InventedLabScenario.GrowingChamber, InventedLabScenario.TemperatureChannel, at, 633.3)]);

        await Assertions.Expect(card).ToHaveTextAsync("633.3 °C", new() { Timeout = 10_000 });
        output.WriteLine($"live value on screen {clock.ElapsedMilliseconds} ms after the notifier call");
    }

    [Fact]
    public async Task Chamber_LiveChart_ShipsAtMostMaxPointsAndShowsReminders()
    {
        var page = await fixture.LoginAsync("test-engineer");
        await page.GotoAsync(fixture.Host.BaseUrl + "/chambers/north-1");
        await Assertions.Expect(page.Locator("#live-chart .main-svg").First).ToBeVisibleAsync(Soon);
        await Assertions.Expect(page.Locator("[data-rule=arsenic-source-hot]").First).ToBeVisibleAsync(Soon);
        int points = int.Parse(await page.Locator("[data-testid=live-chart]").GetAttributeAsync("data-points") ?? "-1");
        Assert.InRange(points, 1, 5000);
        Assert.Empty(await page.Locator("[data-testid=reminder] button").AllAsync());
        await fixture.ScreenshotAsync(page, "chamber");
    }

    [Fact]
    public async Task Alerts_EngineerAcknowledges_AlertMovesToAcknowledgedWithName()
    {
        var page = await fixture.LoginAsync("test-engineer");
        await page.GotoAsync(fixture.Host.BaseUrl + "/alerts");
        var row = page.Locator($"[data-alert={InventedLabScenario.OpenAlert}]");
        await Assertions.Expect(row).ToBeVisibleAsync(Soon);
        await fixture.ScreenshotAsync(page, "alerts");
        await row.Locator("[data-testid=comment]").FillAsync("seen; excursion during growth, wafer held for review");
        await row.Locator("[data-testid=acknowledge]").ClickAsync();

        await Assertions.Expect(page.Locator("[data-testid=alert-message]")).ToContainTextAsync("acknowledged by test-engineer", new() { Timeout = 10_000 });
        await page.ClickAsync("[data-testid=tab-acknowledged]");
        await Assertions.Expect(page.Locator($"[data-alert={InventedLabScenario.OpenAlert}]")).ToContainTextAsync("acknowledged by test-engineer");
        var alerts = await fixture.Host.Data.GetAlertsAsync(CancellationToken.None);
        Assert.Equal(AlertState.ActiveAcknowledged, alerts.Single(a => a.AlertId == InventedLabScenario.OpenAlert).State);
    }

    [Fact]
    public async Task Alerts_ViewerShelve_DisabledAndApiRefused()
    {
        var page = await fixture.LoginAsync("test-viewer");
        await page.GotoAsync(fixture.Host.BaseUrl + "/alerts");
        await page.ClickAsync("[data-testid=tab-acknowledged]");
        var row = page.Locator("[data-alert=A-0106]");
        await Assertions.Expect(row.Locator("[data-testid=shelve]")).ToBeDisabledAsync(new() { Timeout = 10_000 });
        await Assertions.Expect(page.Locator("[data-testid=read-only]")).ToContainTextAsync("viewer");
        await fixture.ScreenshotAsync(page, "alerts-viewer-refused");
        var api = await page.APIRequest.PostAsync(fixture.Host.BaseUrl + "/api/alerts/A-0106/shelve",
            new() { DataObject = new { comment = "try", hours = 1 } });
        Assert.Equal(403, api.Status);
        var alerts = await fixture.Host.Data.GetAlertsAsync(CancellationToken.None);
        Assert.Equal(AlertState.ActiveAcknowledged, alerts.Single(a => a.AlertId == "A-0106").State);
    }

    [Fact]
    public async Task Wafer_DownloadCsvReport_ContainsEveryWire()
    {
        var page = await fixture.LoginAsync("test-viewer");
        await page.GotoAsync(fixture.Host.BaseUrl + "/wafers/" + InventedLabScenario.Wafer);
        await Assertions.Expect(page.Locator("[data-testid=verdict]")).ToBeVisibleAsync(Soon);
        await Assertions.Expect(page.Locator("#radius-histogram .main-svg").First).ToBeVisibleAsync(Soon);
        await fixture.ScreenshotAsync(page, "wafer");
        var download = await page.RunAndWaitForDownloadAsync(() => page.ClickAsync("[data-testid=report-csv]"));
        string path = Path.Combine(fixture.ArtifactsFolder, download.SuggestedFilename);
        await download.SaveAsAsync(path);
        var lines = await File.ReadAllLinesAsync(path);
        Assert.Equal("wire,radius_nm,capture_area_norm,predicted_nm", lines[0]);
        Assert.Equal(241, lines.Length);
    }

    [Fact]
    public async Task EveryScreen_Renders_AndIsCaptured()
    {
        var page = await fixture.LoginAsync("test-admin");
        foreach (var (path, name, selector) in new[]
        {
            ("/runs", "runs", "[data-testid=runs-table]"),
            ("/runs/" + InventedLabScenario.EndedRun, "run", "#run-chart .main-svg"),
            ("/model", "process-model", "#radius-fit .main-svg"),
            ("/planner", "planner", "#planner-histogram .main-svg"),
            ("/settings", "settings", "[data-testid=specs]"),
            ("/safety", "safety", "[data-testid=limits]"),
        })
        {
            await page.GotoAsync(fixture.Host.BaseUrl + path);
            await Assertions.Expect(page.Locator(selector).First).ToBeVisibleAsync(Soon);
            await Assertions.Expect(page.Locator("[data-testid=standing-caution]")).ToBeVisibleAsync();
            await fixture.ScreenshotAsync(page, name);
        }
        await page.GotoAsync(fixture.Host.BaseUrl + "/login");
        await fixture.ScreenshotAsync(page, "login");
    }

    [Fact]
    public async Task Api_WithoutLogin_401_WithLogin_OpenApiListsEndpoints()
    {
        await using var anonymous = await fixture.Context.Browser!.NewContextAsync();
        var refused = await anonymous.APIRequest.GetAsync(fixture.Host.BaseUrl + "/api/runs");
        Assert.Equal(401, refused.Status);

        var page = await fixture.LoginAsync("test-viewer");
        var runs = await page.APIRequest.GetAsync(fixture.Host.BaseUrl + "/api/runs");
        Assert.Equal(200, runs.Status);
        Assert.Contains("\"runId\":\"R-2030\"", await runs.TextAsync(), StringComparison.Ordinal);
        var openApi = await page.APIRequest.GetAsync(fixture.Host.BaseUrl + "/openapi/v1.json");
        string document = await openApi.TextAsync();
        Assert.Equal(200, openApi.Status);
        Assert.Contains("/api/alerts/{alertId}/acknowledge", document, StringComparison.Ordinal);
        Assert.Contains("/api/wafers/{waferId}/reports/{format}", document, StringComparison.Ordinal);
    }
}
