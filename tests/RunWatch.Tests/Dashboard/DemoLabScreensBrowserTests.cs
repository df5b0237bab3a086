using System.Text.RegularExpressions;
using Microsoft.Playwright;
using RunWatch.Tests.Demo;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Tests.Dashboard;

/// <summary>
/// The wafer list, wafer map, trends and run comparison of a real <c>runwatch demo</c> in headless Debian Chromium:
/// they render with the demo's own data, link to each other (map field → field on the wafer page, trend point → run,
/// runs list → comparison), carry no error bar, "NaN" or console error, and are captured with the other screens.
/// </summary>
[Collection(DemoCollection.Name)]
public sealed partial class DemoLabScreensBrowserTests(DemoFixture demo, ITestOutputHelper output)
{
    private const string Wafer = "W-DEMO-01-A";
    private static readonly LocatorAssertionsToBeVisibleOptions Soon = new() { Timeout = 20_000 };

    [Fact]
    public async Task LabScreens_RealDemo_RenderWithDataAndLinkToEachOther()
    {
        await demo.WaitAllReportedAsync();
        var page = await demo.LoginAsync("engineer");
        var errors = new List<string>();
        page.Console += (_, m) =>
        {
            if (m.Type == "error" && !m.Location.Contains("favicon", StringComparison.Ordinal))
            {
                errors.Add(m.Text);
            }
        };

        // Wafer list: every demo wafer, with its run and a map link.
        await page.GotoAsync(demo.BaseUrl + "/wafers");
        // Other tests of the collection may add wafers of their own; the demo's three are there with their runs.
        foreach (var (wafer, ofRun) in new[] { (Wafer, "R-DEMO-01"), ("W-DEMO-01-B", "R-DEMO-01"), ("W-DEMO-02-A", "R-DEMO-02") })
        {
            await Assertions.Expect(page.Locator("[data-testid=wafer-row]", new() { HasText = wafer })).ToContainTextAsync(ofRun, new() { Timeout = 20_000 });
        }
        await CheckAndCaptureAsync(page, "wafers");
        var csv = await page.APIRequest.GetAsync(demo.BaseUrl + "/api/export/wafers.csv");
        string[] lines = (await csv.TextAsync()).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.True(lines.Length >= 4, $"{lines.Length} lines");
        Assert.Contains(lines, l => l.StartsWith(Wafer + ",R-DEMO-01,demo-1,nw-demo,", StringComparison.Ordinal));
        Assert.StartsWith("wafer,run,chamber,process,verdict,date_utc,mean_radius_nm,fields", lines[0], StringComparison.Ordinal);

        // Wafer map: the demo's three fields at their sidecar positions, uniformity and radial trend, a tile opens the field.
        await page.Locator("[data-testid=wafer-row]", new() { HasText = Wafer }).Locator("[data-testid=wafer-map-link]").ClickAsync();
        await page.WaitForURLAsync(new Regex("/wafers/" + Wafer + "/map$"));
        await Assertions.Expect(page.Locator("[data-testid=map-field]")).ToHaveCountAsync(3, new() { Timeout = 20_000 });
        await Assertions.Expect(page.Locator("[data-testid=non-uniformity]")).ToHaveTextAsync(new Regex(@"^\d+\.\d %$"));
        await Assertions.Expect(page.Locator("[data-testid=radial-point]")).ToHaveCountAsync(3);
        await Assertions.Expect(page.Locator("[data-testid=radial-fit]")).ToHaveCountAsync(1);
        await Assertions.Expect(page.Locator("[data-testid=map-field-row]").First).ToContainTextAsync("(-20.0, 0.0)");
        await CheckAndCaptureAsync(page, "wafer-map");
        var waferJson = await page.APIRequest.GetAsync(demo.BaseUrl + "/api/wafers/" + Wafer);
        var mapJson = await page.APIRequest.GetAsync(demo.BaseUrl + "/api/wafers/" + Wafer + "/map");
        output.WriteLine("wafer statistics: " + System.Text.Json.JsonDocument.Parse(await waferJson.TextAsync()).RootElement.GetProperty("statistics"));
        foreach (var f in System.Text.Json.JsonDocument.Parse(await mapJson.TextAsync()).RootElement.GetProperty("fields").EnumerateArray())
        {
            output.WriteLine("map field: " + f.GetProperty("fileName") + " " + f.GetProperty("figures"));
        }
        string fieldHref = (await page.Locator("[data-testid=map-field]").First.GetAttributeAsync("href"))!;
        await page.Locator("[data-testid=map-field]").First.ClickAsync();
        await page.WaitForURLAsync(new Regex("/wafers/" + Wafer + "#field-\\d+$"));
        await Assertions.Expect(page.Locator("#" + fieldHref[(fieldHref.IndexOf('#', StringComparison.Ordinal) + 1)..])).ToBeVisibleAsync(Soon);
        // The wafer page's histogram states its target and predicted bands.
        await Assertions.Expect(page.Locator("[data-testid=histogram-bands]")).ToContainTextAsync("target window 40.0–56.0 nm" /* the demo recipe: 48 ± 8 nm (DemoSettings) */, new() { Timeout = 20_000 });
        await Assertions.Expect(page.Locator("[data-testid=wafer-map-link]")).ToHaveAttributeAsync("href", $"wafers/{Wafer}/map");

        // Trends: both demo runs on the λ_eff chart; a point opens its run.
        await page.GotoAsync(demo.BaseUrl + "/trends?process=nw-demo&chamber=demo-1");
        await Assertions.Expect(page.Locator("[data-testid=trend-leff] [data-testid=trend-point][data-run=R-DEMO-01]")).ToHaveCountAsync(1, new() { Timeout = 20_000 });
        var leffPoints = page.Locator("[data-testid=trend-leff] [data-testid=trend-point][data-run=R-DEMO-02]");
        await Assertions.Expect(leffPoints).ToHaveCountAsync(1);
        await Assertions.Expect(page.Locator("[data-testid=baseline-note]")).ToContainTextAsync("verdict is PASS");
        await Assertions.Expect(page.Locator("[data-testid=limits-radius]")).ToBeVisibleAsync();
        await CheckAndCaptureAsync(page, "trends");
        string run = (await leffPoints.Last.GetAttributeAsync("data-run"))!;
        await leffPoints.Last.ClickAsync();
        await page.WaitForURLAsync(new Regex("/runs/" + run + "$"));
        await Assertions.Expect(page.Locator("h1")).ToContainTextAsync(run, new() { Timeout = 20_000 });

        // Runs list → comparison of the two demo runs: overlay chart and figures side by side, each run linked.
        await page.GotoAsync(demo.BaseUrl + "/runs");
        await Assertions.Expect(page.Locator("[data-testid=run-row]", new() { HasText = "R-DEMO-01" }).Locator("[data-testid=run-mean-radius]")).ToHaveTextAsync(new Regex(@"^\d+\.\d nm$"), new() { Timeout = 20_000 });
        await page.Locator("[data-testid=run-select][data-run=R-DEMO-01]").CheckAsync();
        await page.Locator("[data-testid=run-select][data-run=R-DEMO-02]").CheckAsync();
        await page.Locator("[data-testid=compare-selected]").ClickAsync();
        await page.WaitForURLAsync(new Regex("/compare\\?runs="));
        await Assertions.Expect(page.Locator("[data-testid=compare-run]")).ToHaveTextAsync(["R-DEMO-01", "R-DEMO-02"], new() { Timeout = 20_000 });
        await Assertions.Expect(page.Locator("#compare-thermal .main-svg").First).ToBeVisibleAsync(Soon);
        await Assertions.Expect(page.Locator("#compare-thermal .scatterlayer .trace")).ToHaveCountAsync(2);
        await Assertions.Expect(page.Locator("[data-testid=compare-leff]").First).ToHaveTextAsync(new Regex(@"^\d+\.\d nm$"));
        await CheckAndCaptureAsync(page, "compare");
        await page.Locator("[data-testid=compare-run]", new() { HasText = "R-DEMO-02" }).ClickAsync();
        await page.WaitForURLAsync(new Regex("/runs/R-DEMO-02$"));

        Assert.Empty(errors);
        await page.CloseAsync();
    }

    private async Task CheckAndCaptureAsync(IPage page, string name)
    {
        await Assertions.Expect(page.Locator("[data-testid=standing-caution]")).ToBeVisibleAsync();
        await page.WaitForLoadStateAsync(LoadState.NetworkIdle);
        await Assertions.Expect(page.Locator("#blazor-error-ui")).ToBeHiddenAsync();
        string body = (await page.Locator("main").InnerTextAsync()).ToUpperInvariant();
        Assert.DoesNotContain("EXCEPTION", body, StringComparison.Ordinal);
        Assert.DoesNotContain("NAN", NanInWords().Replace(body, ""), StringComparison.Ordinal);
        output.WriteLine($"{name,-12} {page.Url} {await demo.ScreenshotAsync(page, name)}");
    }

    [GeneratedRegex("[A-Z]NAN|NAN[A-Z]")]
    private static partial Regex NanInWords();
}
