using System.Globalization;
using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using RunWatch.Hosting;
using RunWatch.Testing.Mqtt;
using RunWatch.Web.Security;
using Xunit;

namespace RunWatch.Tests.Security;

/// <summary>
/// The composed program (as <c>runwatch serve</c>) attacked over HTTP: cross-origin state changes, login guessing,
/// bad return URLs, missing headers, cookies behind TLS, and the health status while the broker is away.
/// </summary>
public sealed class WebHardeningTests : IDisposable
{
    private const string Password = "an-invented-test-password";
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-hardening-").FullName;
    private string _baseUrl = "";

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    [Fact]
    public async Task StateChangingEndpoints_FromAnotherOriginOrWithoutEvidence_Refused403AndNothingChanges()
    {
        await using var app = await StartAsync();
        using var engineer = await LoginAsync("eng-1");
        string otherPort = "http://127.0.0.1:" + FreePort.Next().ToString(CultureInfo.InvariantCulture);
        string[] targets = ["/api/models/nw-inv/refit", "/api/models/nw-inv/accept", "/api/wafers/W-1/reanalyse", "/api/fields/upload?name=forged.png", "/account/logout"];

        foreach (string target in targets)
        {
            // A page on another port of the same host (same site: the SameSite=Strict cookie goes along).
            using var crossOrigin = await PostAsync(engineer, target, ("Origin", otherPort));
            using var sameSite = await PostAsync(engineer, target, ("Sec-Fetch-Site", "same-site"));
            using var opaque = await PostAsync(engineer, target, ("Origin", "null"));
            using var noEvidence = await PostAsync(engineer, target);
            Assert.True(crossOrigin.StatusCode == HttpStatusCode.Forbidden, target + " from " + otherPort + ": " + crossOrigin.StatusCode);
            Assert.True(sameSite.StatusCode == HttpStatusCode.Forbidden, target + " same-site: " + sameSite.StatusCode);
            Assert.True(opaque.StatusCode == HttpStatusCode.Forbidden, target + " Origin null: " + opaque.StatusCode);
            Assert.True(noEvidence.StatusCode == HttpStatusCode.Forbidden, target + " without Origin or token: " + noEvidence.StatusCode);
        }

        Assert.False(File.Exists(Path.Combine(_folder, "drop", "uploads", "forged.png")), "a refused upload left a file");
        using var stillLoggedIn = await engineer.GetAsync("/api/chambers");
        Assert.Equal(HttpStatusCode.OK, stillLoggedIn.StatusCode); // the forged logouts did nothing
        string audit = await (await LoginAsync("ada-admin")).GetStringAsync("/api/audit");
        Assert.DoesNotContain("refit", audit, StringComparison.OrdinalIgnoreCase);

        // The same requests from the dashboard's own origin reach their handlers.
        using var refit = await PostAsync(engineer, "/api/models/nw-inv/refit", ("Origin", _baseUrl));
        Assert.Equal(HttpStatusCode.Conflict, refit.StatusCode); // no wafers: refused by the handler with its reason
        using var upload = await PostAsync(engineer, "/api/fields/upload?name=forged.png", ("Origin", _baseUrl));
        Assert.NotEqual(HttpStatusCode.Forbidden, upload.StatusCode);
        Assert.True(File.Exists(Path.Combine(_folder, "drop", "uploads", "forged.png")));
    }

    [Fact]
    public async Task Logout_WithoutItsToken_Refused_WithToken_SignsOut()
    {
        await using var app = await StartAsync();
        using var engineer = await LoginAsync("eng-1");

        using var noToken = await PostAsync(engineer, "/account/logout", ("Origin", _baseUrl));
        Assert.Equal(HttpStatusCode.BadRequest, noToken.StatusCode);
        using (var stillIn = await engineer.GetAsync("/api/chambers"))
        {
            Assert.Equal(HttpStatusCode.OK, stillIn.StatusCode);
        }

        string token = await TokenAsync(engineer);
        using var withToken = await engineer.PostAsync("/account/logout", Form(("__RequestVerificationToken", token)));
        Assert.Equal(HttpStatusCode.Redirect, withToken.StatusCode);
        using var after = await engineer.GetAsync("/api/chambers");
        Assert.Equal(HttpStatusCode.Unauthorized, after.StatusCode);
    }

    [Fact]
    public async Task Login_MoreAttemptsForOneUserThanAllowed_429EvenWithTheRightPassword()
    {
        await using var app = await StartAsync(("RunWatch:Dashboard:LoginAttemptsPerUser", "3"));
        using var client = NewClient();
        for (int i = 0; i < 3; i++)
        {
            using var wrong = await SubmitLoginAsync(client, "eng-1", "wrong-" + i.ToString(CultureInfo.InvariantCulture));
            Assert.Equal(HttpStatusCode.Redirect, wrong.StatusCode);
            Assert.Contains("error=1", wrong.Headers.Location!.OriginalString, StringComparison.Ordinal);
        }

        using var throttled = await SubmitLoginAsync(client, "ENG-1", Password); // the name's case does not open a new budget
        Assert.Equal(HttpStatusCode.TooManyRequests, throttled.StatusCode);
        Assert.NotNull(throttled.Headers.RetryAfter);
        using var otherUser = await SubmitLoginAsync(client, "ada-admin", Password);
        Assert.Equal(HttpStatusCode.Redirect, otherUser.StatusCode);
        Assert.Equal("/", otherUser.Headers.Location!.OriginalString);
    }

    [Fact]
    public async Task Login_MoreAttemptsFromOneAddressThanAllowed_429WhateverTheName()
    {
        await using var app = await StartAsync(("RunWatch:Dashboard:LoginAttemptsPerAddress", "4"));
        using var client = NewClient();
        for (int i = 0; i < 4; i++)
        {
            using var wrong = await SubmitLoginAsync(client, "guess-" + i.ToString(CultureInfo.InvariantCulture), "x");
            Assert.Equal(HttpStatusCode.Redirect, wrong.StatusCode);
        }

        using var throttled = await SubmitLoginAsync(client, "eng-1", Password);
        Assert.Equal(HttpStatusCode.TooManyRequests, throttled.StatusCode);
        Assert.NotNull(throttled.Headers.RetryAfter);
    }

    [Theory]
    [InlineData("/runs\r\nSet-Cookie: x=1")]
    [InlineData("/runs\u0001")]
    [InlineData("//evil.example/")]
    [InlineData("/\\evil.example/")]
    [InlineData("https://evil.example/")]
    public async Task Login_BadReturnUrl_400NotServerError(string returnUrl)
    {
        await using var app = await StartAsync();
        using var client = NewClient();
        using var response = await SubmitLoginAsync(client, "eng-1", Password, returnUrl);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.False(response.Headers.Contains("Set-Cookie") && response.Headers.GetValues("Set-Cookie").Any(c => c.StartsWith("runwatch.auth", StringComparison.Ordinal)));
    }

    [Fact]
    public async Task Login_GoodReturnUrl_RedirectsThere()
    {
        await using var app = await StartAsync();
        using var client = NewClient();
        using var response = await SubmitLoginAsync(client, "eng-1", Password, "/runs?x=1");
        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        Assert.Equal("/runs?x=1", response.Headers.Location!.OriginalString);
    }

    [Fact]
    public async Task Responses_CarryContentSecurityPolicyAndNosniff()
    {
        await using var app = await StartAsync();
        using var client = NewClient();
        foreach (string path in new[] { "/login", "/", "/healthz", "/_framework/blazor.web.js" })
        {
            using var response = await client.GetAsync(path);
            Assert.True(response.Headers.TryGetValues("Content-Security-Policy", out var csp), path + " has no CSP");
            string policy = csp!.Single();
            Assert.Contains("default-src 'self'", policy, StringComparison.Ordinal);
            Assert.Contains("script-src 'self'", policy, StringComparison.Ordinal);
            Assert.DoesNotContain("unsafe-eval", policy, StringComparison.Ordinal);
            Assert.Contains("frame-ancestors 'none'", policy, StringComparison.Ordinal);
            Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        }
    }

    [Fact]
    public async Task Cookies_BehindTlsProxy_AreSecure_OverPlainHttp_AreNot()
    {
        await using var app = await StartAsync();
        using var plain = NewClient();
        using var plainLogin = await plain.GetAsync("/login");
        Assert.DoesNotContain(AntiforgeryCookies(plainLogin), c => c.Contains("secure", StringComparison.OrdinalIgnoreCase));

        using var proxied = NewClient();
        proxied.DefaultRequestHeaders.Add("X-Forwarded-Proto", "https");
        using var proxiedLogin = await proxied.GetAsync("/login");
        var cookies = AntiforgeryCookies(proxiedLogin);
        Assert.NotEmpty(cookies);
        Assert.All(cookies, c => Assert.Contains("secure", c, StringComparison.OrdinalIgnoreCase));
    }

    [Fact]
    public async Task Healthz_BrokerUnreachable_503_Connected_200()
    {
        // External broker on a port nobody listens on: the daemon cannot connect.
        await using (var away = await StartAsync(("Broker:Mode", "External"), ("Broker:Port", FreePort.Next().ToString(CultureInfo.InvariantCulture))))
        {
            using var client = NewClient();
            using var response = await client.GetAsync("/healthz");
            string body = await response.Content.ReadAsStringAsync();
            Assert.Equal(HttpStatusCode.ServiceUnavailable, response.StatusCode);
            Assert.Contains("\"broker\"", body, StringComparison.Ordinal);
        }

        await using var embedded = await StartAsync();
        using var http = NewClient();
        var health = embedded.Services.GetRequiredService<RunWatch.Ingest.Health.IngestHealth>();
        var deadline = DateTime.UtcNow.AddSeconds(30);
        while (health.Snapshot().BrokerState != RunWatch.Ingest.Health.BrokerConnectionState.Connected && DateTime.UtcNow < deadline)
        {
            await Task.Delay(50);
        }
        using var healthy = await http.GetAsync("/healthz");
        Assert.Equal(HttpStatusCode.OK, healthy.StatusCode);
    }

    private static List<string> AntiforgeryCookies(HttpResponseMessage response) =>
        response.Headers.TryGetValues("Set-Cookie", out var all) ? all.Where(c => c.StartsWith(".AspNetCore.Antiforgery", StringComparison.Ordinal)).ToList() : [];

    private async Task<WebApplication> StartAsync(params (string Key, string Value)[] overrides)
    {
        var settings = new Dictionary<string, string?>
        {
            ["Urls"] = _baseUrl = "http://127.0.0.1:" + FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["ChambersFile"] = Path.Combine(_folder, "none.json"),
            ["Storage:DataDirectory"] = _folder,
            ["Broker:Mode"] = "Embedded",
            ["Broker:Host"] = "127.0.0.1",
            ["Broker:Port"] = FreePort.Next().ToString(CultureInfo.InvariantCulture),
            ["Broker:ReconnectInitialDelay"] = "00:00:00.200",
            ["Broker:ReconnectMaxDelay"] = "00:00:01",
            ["Chambers:0:Name"] = "c1",
            ["Chambers:0:Site"] = "invented lab",
            ["Chambers:0:Channels:0:Name"] = "substrate_tc",
            ["Chambers:0:Channels:0:Role"] = "GrowthTemperature",
            ["Chambers:0:Channels:0:Unit"] = "degC",
        };
        foreach (var (key, value) in overrides)
        {
            settings[key] = value;
        }
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { EnvironmentName = Environments.Development, ApplicationName = "runwatch" });
        builder.Configuration.AddInMemoryCollection(settings);
        builder.WebHost.UseStaticWebAssets();
        builder.AddRunWatch([]);
        var app = builder.Build();
        var users = app.Services.GetRequiredService<UserDirectory>();
        users.AddWithPassword("ada-admin", DashboardRoles.Admin, Password);
        users.AddWithPassword("eng-1", DashboardRoles.Engineer, Password);
        app.MapRunWatch();
        await app.StartAsync();
        return app;
    }

    private HttpClient NewClient() =>
        new(new HttpClientHandler { CookieContainer = new CookieContainer(), AllowAutoRedirect = false }) { BaseAddress = new Uri(_baseUrl) };

    /// <summary>Logs in through the login form as the browser does (token and the page's own Origin).</summary>
    private async Task<HttpClient> LoginAsync(string user)
    {
        var client = NewClient();
        using var response = await SubmitLoginAsync(client, user, Password);
        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        Assert.Equal("/", response.Headers.Location?.OriginalString);
        return client;
    }

    private async Task<HttpResponseMessage> SubmitLoginAsync(HttpClient client, string user, string password, string? returnUrl = null)
    {
        string token = await TokenAsync(client);
        var fields = new List<(string, string)> { ("username", user), ("password", password), ("__RequestVerificationToken", token) };
        if (returnUrl is not null)
        {
            fields.Add(("returnUrl", returnUrl));
        }
        using var request = new HttpRequestMessage(HttpMethod.Post, "/account/login") { Content = Form([.. fields]) };
        request.Headers.Add("Origin", _baseUrl);
        return await client.SendAsync(request);
    }

    /// <summary>The antiforgery token of the login page, issued for whoever the client is signed in as.</summary>
    private static async Task<string> TokenAsync(HttpClient client)
    {
        string page = await client.GetStringAsync("/login");
        string input = Regex.Match(page, "<input[^>]*__RequestVerificationToken[^>]*>").Value;
        return WebUtility.HtmlDecode(Regex.Match(input, "value=\"([^\"]+)\"").Groups[1].Value);
    }

    private static FormUrlEncodedContent Form(params (string Key, string Value)[] fields) =>
        new(fields.Select(f => new KeyValuePair<string, string>(f.Key, f.Value)));

    /// <summary>A plain text/plain POST, as a cross-site form or fetch without preflight sends it.</summary>
    private static async Task<HttpResponseMessage> PostAsync(HttpClient client, string path, params (string Name, string Value)[] headers)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent("x", Encoding.UTF8, "text/plain") };
        foreach (var (name, value) in headers)
        {
            request.Headers.TryAddWithoutValidation(name, value);
        }
        return await client.SendAsync(request);
    }
}
