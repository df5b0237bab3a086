using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using Microsoft.Playwright;
using RunWatch.Testing.Mqtt;
using RunWatch.Tests.Dashboard;
using Xunit;

namespace RunWatch.Tests.Demo;

/// <summary>
/// One real <c>runwatch demo</c> child process (embedded broker, SQLite, the whole pipeline) on free ports and a
/// temp data folder, kept running after its last report, shared by the tests of <see cref="DemoCollection"/>. The
/// dashboard address and the demo users are read from what it prints, as a newcomer reads them; Chromium is
/// started on first use.
/// </summary>
public sealed partial class DemoFixture : IAsyncLifetime
{
    /// <summary>What the demo prints once every demo wafer has its report.</summary>
    public const string AllReportedLine = "[demo] all demo wafers reported";

    /// <summary>The dashboard's time zone in the demo under test (UTC+01:00 in winter, +02:00 in summer).</summary>
    public const string LabTimeZone = "Europe/Berlin";

    private readonly StringBuilder _output = new();
    private readonly SemaphoreSlim _browserGate = new(1, 1);
    private Process _process = default!;
    private IPlaywright? _playwright;
    private IBrowserContext? _browser;
    private string? _profile;
    private string? _loggedInRole;

    public string DataFolder { get; } = Path.Combine(Path.GetTempPath(), "rw-demo-" + Guid.NewGuid().ToString("N"));

    public int BrokerPort { get; } = FreePort.Next();

    /// <summary>The dashboard address the demo printed.</summary>
    public string BaseUrl { get; private set; } = "";

    /// <summary>Demo users by role, as printed.</summary>
    public IReadOnlyDictionary<string, DemoUser> Users { get; private set; } = new Dictionary<string, DemoUser>();

    /// <summary>Screenshots and downloads of the tests over the demo (printed by the tests).</summary>
    public string ArtifactsFolder { get; } = Path.Combine(AppContext.BaseDirectory, "artifacts", "demo-dashboard");

    public string Output
    {
        get
        {
            lock (_output)
            {
                return _output.ToString();
            }
        }
    }

    public bool HasExited => _process.HasExited;

    public async Task InitializeAsync()
    {
        Directory.CreateDirectory(ArtifactsFolder);
        int httpPort = FreePort.Next();
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string a in new[]
        {
            Path.Combine(AppContext.BaseDirectory, "runwatch.dll"), "demo", "--data-folder", DataFolder,
            "--Broker:Port=" + BrokerPort.ToString(CultureInfo.InvariantCulture), "--Urls=http://127.0.0.1:" + httpPort.ToString(CultureInfo.InvariantCulture),
            // A lab zone with an offset, so that the screens are seen to show local time with its UTC offset.
            "--RunWatch:Dashboard:TimeZone=" + LabTimeZone,
        })
        {
            psi.ArgumentList.Add(a);
        }
        psi.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        _process = new Process { StartInfo = psi };
        _process.OutputDataReceived += (_, e) => Append(e.Data);
        _process.ErrorDataReceived += (_, e) => Append(e.Data);
        _process.Start();
        _process.BeginOutputReadLine();
        _process.BeginErrorReadLine();

        // The users are printed after the address; the health line comes after the last user.
        await WaitForOutputAsync("  health ", TimeSpan.FromMinutes(1));
        string text = Output;
        BaseUrl = DashboardLine().Match(text) is { Success: true } m ? m.Groups[1].Value
            : throw new InvalidOperationException("the demo printed no dashboard address:\n" + text);
        var users = new Dictionary<string, DemoUser>(StringComparer.Ordinal);
        foreach (Match u in UserLine().Matches(text))
        {
            users[u.Groups[2].Value] = new DemoUser(u.Groups[1].Value, u.Groups[2].Value, u.Groups[3].Value);
        }
        Users = users;
    }

    /// <summary>Waits until the demo has printed <paramref name="text"/>; fails early if it exits.</summary>
    public async Task WaitForOutputAsync(string text, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!Output.Contains(text, StringComparison.Ordinal))
        {
            if (_process.HasExited)
            {
                throw new InvalidOperationException($"runwatch demo exited ({_process.ExitCode}) before printing '{text}':\n{Output}");
            }
            if (DateTime.UtcNow > deadline)
            {
                throw new TimeoutException($"runwatch demo did not print '{text}' within {timeout}:\n{Output}");
            }
            await Task.Delay(100);
        }
    }

    /// <summary>Waits until every demo wafer has its report (the demo takes about two minutes on a quiet machine).</summary>
    public Task WaitAllReportedAsync() => WaitForOutputAsync(AllReportedLine, TimeSpan.FromMinutes(8));

    /// <summary>The shared Chromium (a fresh profile of its own), started on first use.</summary>
    public async Task<IBrowserContext> BrowserAsync()
    {
        await _browserGate.WaitAsync();
        try
        {
            if (_browser is null)
            {
                _playwright = await Playwright.CreateAsync();
                _profile = Directory.CreateTempSubdirectory("runwatch-demo-chromium-").FullName;
                _browser = await HeadlessChromium.LaunchAsync(_playwright, _profile);
            }
            return _browser;
        }
        finally
        {
            _browserGate.Release();
        }
    }

    /// <summary>
    /// A new page logged in through the login form as the printed user of <paramref name="role"/>. The tests of the
    /// collection run one at a time, so clearing the shared profile's cookies first is enough to change user.
    /// </summary>
    public async Task<IPage> LoginAsync(string role)
    {
        DemoUser user = Users[role];
        var context = await BrowserAsync();
        if (_loggedInRole == role && (await context.CookiesAsync()).Any(c => c.Name == "runwatch.auth"))
        {
            // Still logged in as that user: the dashboard limits logins per user name and minute, as a site would want.
            var again = await context.NewPageAsync();
            await again.GotoAsync(BaseUrl + "/");
            await again.WaitForSelectorAsync("[data-testid=who]", new() { Timeout = 20_000 });
            return again;
        }
        _loggedInRole = null;
        await context.ClearCookiesAsync();
        var page = await context.NewPageAsync();
        await page.GotoAsync(BaseUrl + "/login");
        await page.FillAsync("input[name=username]", user.Name);
        await page.FillAsync("input[name=password]", user.Password);
        await page.ClickAsync("button[type=submit]");
        await page.WaitForSelectorAsync("[data-testid=who]", new() { Timeout = 20_000 });
        _loggedInRole = role;
        return page;
    }

    /// <summary>Full-page screenshot into <see cref="ArtifactsFolder"/>; returns its path.</summary>
    public async Task<string> ScreenshotAsync(IPage page, string name)
    {
        string path = Path.Combine(ArtifactsFolder, name + ".png");
        await page.ScreenshotAsync(new PageScreenshotOptions { Path = path, FullPage = true });
        return path;
    }

    public async Task DisposeAsync()
    {
        if (_browser is not null)
        {
            await _browser.CloseAsync();
        }
        _playwright?.Dispose();
        if (!_process.HasExited)
        {
            // Ctrl+C, as a newcomer stops it.
            using (var interrupt = Process.Start("kill", ["-INT", _process.Id.ToString(CultureInfo.InvariantCulture)]))
            {
                await interrupt.WaitForExitAsync();
            }
            using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(30));
            try
            {
                await _process.WaitForExitAsync(timeout.Token);
            }
            catch (OperationCanceledException)
            {
                _process.Kill(entireProcessTree: true);
                await _process.WaitForExitAsync();
            }
        }
        // What the demo printed, beside the screenshots, for whoever reads a failure.
        await File.WriteAllTextAsync(Path.Combine(ArtifactsFolder, "demo-output.txt"), Output);
        _process.Dispose();
        _browserGate.Dispose();
        foreach (string? folder in new[] { DataFolder, _profile })
        {
            if (folder is not null && Directory.Exists(folder))
            {
                try
                {
                    Directory.Delete(folder, recursive: true);
                }
                catch (IOException)
                {
                    // Chromium may hold its lock file a moment longer; the OS cleans temp folders.
                }
            }
        }
    }

    private void Append(string? line)
    {
        if (line is null)
        {
            return;
        }
        lock (_output)
        {
            if (_output.Length < 400_000)
            {
                _output.AppendLine(line);
            }
        }
    }

    [GeneratedRegex(@"^\s*dashboard\s+(http://\S+)", RegexOptions.Multiline)]
    private static partial Regex DashboardLine();

    [GeneratedRegex(@"^\s*demo user\s+(\S+)\s+role\s+(\S+)\s+password\s+(\S+)\s*$", RegexOptions.Multiline)]
    private static partial Regex UserLine();
}
