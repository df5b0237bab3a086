using System.Net.Http.Headers;
using System.Net.Http.Json;
using Microsoft.Extensions.Options;

namespace RunWatch.Ingest.Alerts;

/// <summary>POSTs alert changes as JSON to the configured URL; retries with backoff come from the named client's resilience handler.</summary>
internal sealed class WebhookAlertSink(IHttpClientFactory clients, IOptions<AlertsOptions> options) : IAlertSink
{
    public const string ClientName = "runwatch-alert-webhook";

    public string Name => "webhook";

    public async Task SendAsync(AlertNotification notification, CancellationToken cancellationToken)
    {
        var o = options.Value;
        using var request = new HttpRequestMessage(HttpMethod.Post, o.WebhookUrl)
        {
            Content = JsonContent.Create(AlertJson.From(notification), AlertJsonContext.Default.AlertJson),
        };
        if (!string.IsNullOrEmpty(o.WebhookBearerToken))
        {
            request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", o.WebhookBearerToken);
        }
        var client = clients.CreateClient(ClientName);
        using var response = await client.SendAsync(request, cancellationToken).ConfigureAwait(false);
        response.EnsureSuccessStatusCode();
    }
}
