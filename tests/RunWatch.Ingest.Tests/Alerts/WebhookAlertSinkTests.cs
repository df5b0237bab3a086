using System.Net;
using System.Text;
using System.Text.Json;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using RunWatch.Ingest.Alerts;
using RunWatch.Storage;
using RunWatch.Testing.Mqtt;

namespace RunWatch.Ingest.Tests.Alerts;

/// <summary>
/// The webhook sink as the daemon registers it (named client + resilience handler), posting to a real HTTP listener
/// on loopback that answers as a flaky receiver would.
/// </summary>
public sealed class WebhookAlertSinkTests
{
    private static readonly DateTimeOffset Raised = new(2026, 5, 6, 7, 8, 9, TimeSpan.Zero);

    [Fact]
    public async Task SendAsync_ReceiverFailsTwiceThenAccepts_RetriesAndDeliversTheAlertJsonWithToken()
    {
        using var receiver = new FlakyReceiver(HttpStatusCode.ServiceUnavailable, HttpStatusCode.BadGateway);
        using var provider = Provider(receiver.Url, retries: 4);
        var sink = Webhook(provider);

        await sink.SendAsync(Notification(), CancellationToken.None);

        Assert.Equal(3, receiver.Attempts);
        using var json = JsonDocument.Parse(receiver.LastBody!);
        var root = json.RootElement;
        Assert.Equal(1, root.GetProperty("version").GetInt32());
        Assert.Equal("raised", root.GetProperty("change").GetString());
        Assert.Equal("C1", root.GetProperty("chamber").GetString());
        Assert.Equal("temperature-high", root.GetProperty("kind").GetString());
        Assert.Equal("high", root.GetProperty("severity").GetString());
        Assert.Equal(Raised, root.GetProperty("raisedAt").GetDateTimeOffset());
        Assert.Equal(642.5, root.GetProperty("value").GetDouble());
        Assert.Equal("Bearer test-token-not-a-secret", receiver.LastAuthorization);
        Assert.StartsWith("application/json", receiver.LastContentType, StringComparison.Ordinal);
    }

    [Fact]
    public async Task SendAsync_ReceiverRefusesWith400_DoesNotRetryAndReportsFailure()
    {
        using var receiver = new FlakyReceiver(HttpStatusCode.BadRequest, HttpStatusCode.BadRequest);
        using var provider = Provider(receiver.Url, retries: 4);

        await Assert.ThrowsAsync<HttpRequestException>(() => Webhook(provider).SendAsync(Notification(), CancellationToken.None));

        Assert.Equal(1, receiver.Attempts);
    }

    [Fact]
    public async Task SendAsync_ReceiverAlwaysDown_GivesUpAfterConfiguredRetries()
    {
        var failures = Enumerable.Repeat(HttpStatusCode.InternalServerError, 10).ToArray();
        using var receiver = new FlakyReceiver(failures);
        using var provider = Provider(receiver.Url, retries: 2);

        await Assert.ThrowsAsync<HttpRequestException>(() => Webhook(provider).SendAsync(Notification(), CancellationToken.None));

        Assert.Equal(3, receiver.Attempts);
    }

    private static ServiceProvider Provider(string url, int retries)
    {
        var services = new ServiceCollection();
        services.AddLogging(b => b.SetMinimumLevel(LogLevel.Warning));
        services.Configure<AlertsOptions>(o =>
        {
            o.WebhookUrl = url;
            o.WebhookBearerToken = "test-token-not-a-secret";
            o.WebhookRetries = retries;
            o.WebhookRetryDelay = TimeSpan.FromMilliseconds(10);
            o.WebhookAttemptTimeout = TimeSpan.FromSeconds(5);
        });
        services.AddWebhookAlertSink();
        return services.BuildServiceProvider();
    }

    private static IAlertSink Webhook(ServiceProvider provider) => provider.GetServices<IAlertSink>().Single(s => s.Name == "webhook");

    private static AlertNotification Notification() => new(new AlertRecord
    {
        Id = 7,
        Key = "C1/temperature-high",
        Chamber = "C1",
        Kind = "temperature-high",
        Severity = AlertSeverity.High,
        State = AlertState.Unacknowledged,
        Message = "substrate 642.5 °C, 22.5 K above setpoint (invented test alert)",
        RaisedAt = Raised,
        UpdatedAt = Raised,
        PeakValue = 642.5,
    }, "raised", "lab");

    /// <summary>An HTTP listener on a free loopback port answering the given statuses in turn, then 200.</summary>
    private sealed class FlakyReceiver : IDisposable
    {
        private readonly HttpListener _listener = new();
        private readonly Queue<HttpStatusCode> _answers;
        private readonly Task _serving;
        private int _attempts;

        public FlakyReceiver(params HttpStatusCode[] answers)
        {
            _answers = new Queue<HttpStatusCode>(answers);
            Url = $"http://127.0.0.1:{FreePort.Next()}/alerts/";
            _listener.Prefixes.Add(Url);
            _listener.Start();
            _serving = Task.Run(ServeAsync);
        }

        public string Url { get; }

        public int Attempts => Volatile.Read(ref _attempts);

        public string? LastBody { get; private set; }

        public string? LastAuthorization { get; private set; }

        public string? LastContentType { get; private set; }

        public void Dispose()
        {
            _listener.Stop();
            _listener.Close();
            try
            {
                _serving.Wait(TimeSpan.FromSeconds(5));
            }
            catch (AggregateException)
            {
                // The listener was stopped under a pending GetContextAsync.
            }
        }

        private async Task ServeAsync()
        {
            while (_listener.IsListening)
            {
                HttpListenerContext context;
                try
                {
                    context = await _listener.GetContextAsync();
                }
                catch (Exception ex) when (ex is HttpListenerException or ObjectDisposedException or InvalidOperationException)
                {
                    return;
                }
                using (var reader = new StreamReader(context.Request.InputStream, Encoding.UTF8))
                {
                    LastBody = await reader.ReadToEndAsync();
                }
                LastAuthorization = context.Request.Headers["Authorization"];
                LastContentType = context.Request.ContentType;
                Interlocked.Increment(ref _attempts);
                context.Response.StatusCode = (int)(_answers.Count > 0 ? _answers.Dequeue() : HttpStatusCode.OK);
                context.Response.Close();
            }
        }
    }
}
