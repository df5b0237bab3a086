using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace RunWatch.Ingest.Health;

/// <summary>
/// Healthy while connected to the broker; unhealthy otherwise (connecting, disconnected, refused), so /healthz answers
/// 503 and a monitor that reads only the status code sees the outage. Telemetry cannot arrive while it lasts.
/// </summary>
internal sealed class BrokerHealthCheck(IngestHealth health) : IHealthCheck
{
    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var s = health.Snapshot();
        var data = new Dictionary<string, object> { ["state"] = s.BrokerState.ToString(), ["since"] = s.BrokerStateSince };
        if (s.BrokerError is not null)
        {
            data["lastError"] = s.BrokerError;
        }
        return Task.FromResult(s.BrokerState == BrokerConnectionState.Connected
            ? HealthCheckResult.Healthy("connected", data)
            : HealthCheckResult.Unhealthy(s.BrokerState.ToString().ToLowerInvariant(), data: data));
    }
}
