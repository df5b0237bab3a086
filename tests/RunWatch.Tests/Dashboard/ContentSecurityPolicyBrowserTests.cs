using Microsoft.Playwright;
using RunWatch.Testing.Dashboard;
using Xunit;

namespace RunWatch.Tests.Dashboard;

/// <summary>
/// The dashboard in Debian's Chromium under its own Content-Security-Policy: every screen becomes interactive and
/// draws its charts without a single policy violation, and the logout button (a form with its antiforgery token in
/// an interactive page) signs out.
/// </summary>
public sealed class ContentSecurityPolicyBrowserTests(BrowserFixture fixture, Xunit.Abstractions.ITestOutputHelper output) : IClassFixture<BrowserFixture>
{
    private static readonly LocatorAssertionsToBeVisibleOptions Soon = new() { Timeout = 15_000 };

    [Fact]
    public async Task EveryScreen_UnderThePolicy_NoViolationAndLogoutSignsOut()
    {
        var page = await fixture.LoginAsync("test-admin");
        var violations = new List<string>();
        page.Console += (_, message) =>
        {
            if (message.Text.Contains("Content Security Policy", StringComparison.OrdinalIgnoreCase) || message.Text.Contains("Refused to", StringComparison.Ordinal))
            {
                violations.Add(message.Text);
            }
        };
        page.PageError += (_, error) => violations.Add("page error: " + error);
        foreach (var (path, selector) in new[]
        {
            ("/", "[data-chamber=north-1] [data-testid=temperature]"),
            ("/chambers/north-1", "#live-chart .main-svg"),
            ("/runs/" + InventedLabScenario.EndedRun, "#run-chart .main-svg"),
            ("/model", "#radius-fit .main-svg"),
            ("/planner", "#planner-histogram .main-svg"),
            ("/settings", "[data-testid=specs]"),
            ("/alerts", "[data-testid=tab-acknowledged]"),
        })
        {
            await page.GotoAsync(fixture.Host.BaseUrl + path);
            await Assertions.Expect(page.Locator(selector).First).ToBeVisibleAsync(Soon);
        }
        output.WriteLine(violations.Count == 0 ? "no policy violation on 7 screens" : string.Join('\n', violations));
        Assert.Empty(violations);

        await page.ClickAsync("form.logout button");
        await page.WaitForURLAsync("**/login", new() { Timeout = 15_000 });
        var api = await page.APIRequest.GetAsync(fixture.Host.BaseUrl + "/api/runs");
        Assert.Equal(401, api.Status);
    }
}
