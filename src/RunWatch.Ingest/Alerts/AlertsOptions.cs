using System.ComponentModel.DataAnnotations;

namespace RunWatch.Ingest.Alerts;

/// <summary>Alert sinks, bound from the <c>Alerts</c> section.</summary>
public sealed class AlertsOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Alerts";

    /// <summary>Publish alert changes on <c>{root}/{site}/{chamber}/alert</c> (daemon-wide ones on <c>{root}/daemon/{instance}/alert</c>). <value>Default true.</value></summary>
    public bool PublishToMqtt { get; set; } = true;

    /// <summary>Log alert changes. <value>Default true.</value></summary>
    public bool Log { get; set; } = true;

    /// <summary>HTTP(S) URL that receives each alert change as a JSON POST; null for none.</summary>
    [Url]
    public string? WebhookUrl { get; set; }

    /// <summary>Bearer token sent to the webhook, or null. Never logged; supply it by environment variable.</summary>
    public string? WebhookBearerToken { get; set; }

    /// <summary>Retries of a failed webhook POST (exponential backoff with jitter). <value>Default 4.</value></summary>
    [Range(0, 20)]
    public int WebhookRetries { get; set; } = 4;

    /// <summary>First retry delay; doubles each retry. <value>Default 1 s.</value></summary>
    public TimeSpan WebhookRetryDelay { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>Timeout of one POST attempt. <value>Default 10 s.</value></summary>
    public TimeSpan WebhookAttemptTimeout { get; set; } = TimeSpan.FromSeconds(10);
}
