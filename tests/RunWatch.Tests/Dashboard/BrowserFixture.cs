using Microsoft.Playwright;
using Xunit;

namespace RunWatch.Tests.Dashboard;

/// <summary>Debian's Chromium driven by Playwright (never a downloaded browser), plus the dashboard test host.</summary>
public sealed class BrowserFixture : IAsyncLifetime
{
    private IPlaywright? _playwright;
    private string? _profile;

    internal DashboardTestHost Host { get; private set; } = default!;

    public IBrowserContext Context { get; private set; } = default!;

    public IBrowser Browser { get; private set; } = default!;

    public string ArtifactsFolder { get; } = Path.Combine(AppContext.BaseDirectory, "artifacts", "dashboard");

    public async Task InitializeAsync()
    {
        Directory.CreateDirectory(ArtifactsFolder);
        Host = await DashboardTestHost.StartAsync();
        _playwright = await Playwright.CreateAsync();
        _profile = Directory.CreateTempSubdirectory("runwatch-chromium-").FullName;
        Context = await HeadlessChromium.LaunchAsync(_playwright, _profile);
        Browser = Context.Browser!;
    }

    /// <summary>A new page logged in as the given user (each test logs in afresh).</summary>
    public async Task<IPage> LoginAsync(string user)
    {
        await Context.ClearCookiesAsync();
        var page = await Context.NewPageAsync();
        await page.GotoAsync(Host.BaseUrl + "/login");
        await page.FillAsync("input[name=username]", user);
        await page.FillAsync("input[name=password]", DashboardTestHost.Password);
        await page.ClickAsync("button[type=submit]");
        try
        {
            await page.WaitForSelectorAsync("[data-testid=who]", new() { Timeout = 15_000 });
        }
        catch (TimeoutException)
        {
            await ScreenshotAsync(page, "login-failed-" + user);
            var js = await page.APIRequest.GetAsync(Host.BaseUrl + "/_framework/blazor.web.js");
            var css = await page.APIRequest.GetAsync(Host.BaseUrl + "/_content/RunWatch.Web/runwatch.css");
            var plotly = await page.APIRequest.GetAsync(Host.BaseUrl + "/_content/Plotly.Blazor/plotly-3.7.0.min.js");
            await File.WriteAllTextAsync(Path.Combine(ArtifactsFolder, "login-failed-" + user + ".html"),
                $"{page.Url} js {js.Status} css {css.Status} plotly {plotly.Status}\n" + await page.ContentAsync());
            throw;
        }
        return page;
    }

    public Task ScreenshotAsync(IPage page, string name) =>
        page.ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(ArtifactsFolder, name + ".png"), FullPage = true });

    public async Task DisposeAsync()
    {
        if (Context is not null)
        {
            await Context.CloseAsync();
        }
        _playwright?.Dispose();
        await Host.DisposeAsync();
        if (_profile is not null)
        {
            try
            {
                Directory.Delete(_profile, recursive: true);
            }
            catch (IOException)
            {
                // Chromium may still hold a lock file for a moment; the temp folder is cleaned by the OS.
            }
        }
    }
}
