using Microsoft.Extensions.Diagnostics.HealthChecks;
using RunWatch.Storage;

namespace RunWatch.Ingest.Health;

/// <summary>Unhealthy while batch commits fail; otherwise proves writability with a small real write.</summary>
internal sealed class StoreHealthCheck(IngestHealth health, IRunWatchStore store) : IHealthCheck
{
    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var s = health.Snapshot();
        var data = new Dictionary<string, object> { ["consecutiveCommitFailures"] = s.ConsecutiveCommitFailures };
        if (s.LastCommitAt is { } last)
        {
            data["lastCommitAt"] = last;
        }
        if (!s.StoreWritable)
        {
            data["error"] = s.StoreError ?? "";
            return HealthCheckResult.Unhealthy("store not writable; nothing is being acknowledged", data: data);
        }
        try
        {
            await store.ProbeWriteAsync(cancellationToken).ConfigureAwait(false);
            return HealthCheckResult.Healthy("writable", data);
        }
        catch (StoreUnavailableException ex)
        {
            data["error"] = ex.Message;
            return HealthCheckResult.Unhealthy("store not writable", data: data);
        }
    }
}
