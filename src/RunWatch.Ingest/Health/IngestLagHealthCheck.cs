using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace RunWatch.Ingest.Health;

/// <summary>
/// Reports the ingest lag: queue depth, the last batch's arrival-to-commit time and how far the newest committed
/// sample trails the clock (which grows while a backlog waits at the broker). Degraded beyond one minute of sample lag.
/// </summary>
internal sealed class IngestLagHealthCheck(IngestHealth health) : IHealthCheck
{
    private const double DegradedSampleLagMs = 60_000;

    public Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var s = health.Snapshot();
        var data = new Dictionary<string, object>
        {
            ["queueDepth"] = s.QueueDepth,
            ["lastBatchLatencyMs"] = Math.Round(s.LastBatchLatencyMs, 1),
            ["lastSampleLagMs"] = Math.Round(s.LastSampleLagMs, 1),
            ["committedMessages"] = s.CommittedMessages,
        };
        return Task.FromResult(s.LastSampleLagMs > DegradedSampleLagMs
            ? HealthCheckResult.Degraded("newest committed sample trails the clock by more than a minute", data: data)
            : HealthCheckResult.Healthy("ok", data));
    }
}
