using Microsoft.Playwright;

namespace RunWatch.Tests.Dashboard;

/// <summary>Debian's Chromium under Playwright with the flags the dashboard tests use; never a downloaded browser.</summary>
internal static class HeadlessChromium
{
    public const string ExecutablePath = "/usr/bin/chromium";

    /// <summary>
    /// A persistent context is how Playwright takes a fresh <c>--user-data-dir</c> of our own (<paramref name="profile"/>).
    /// The page clock runs in a zone with a UTC offset, so screens must show times with their offset.
    /// </summary>
    public static Task<IBrowserContext> LaunchAsync(IPlaywright playwright, string profile) =>
        playwright.Chromium.LaunchPersistentContextAsync(profile, new BrowserTypeLaunchPersistentContextOptions
        {
            ExecutablePath = ExecutablePath,
            Headless = true,
            Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
            ViewportSize = new ViewportSize { Width = 1440, Height = 1000 },
            AcceptDownloads = true,
            TimezoneId = "Europe/Berlin",
        });
}
