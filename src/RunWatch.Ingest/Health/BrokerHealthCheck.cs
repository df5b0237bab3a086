using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace RunWatch.Ingest.Health;

/// <summary>Healthy while connected to the broker; degraded while (re)connecting.</summary>
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
            : HealthCheckResult.Degraded(s.BrokerState.ToString().ToLowerInvariant(), data: data));
    }
}
