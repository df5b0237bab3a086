using Microsoft.Extensions.Diagnostics.HealthChecks;
using RunWatch.Web.Data;

namespace RunWatch.Web.Safety;

/// <summary>
/// The <c>reminders</c> entry of /healthz: Degraded, with one data item per chamber and reminder, while any reminder
/// is not watched on a chamber (its role has no channel there, or the channel is stale), so that a reminder that
/// cannot fire is visible to monitoring too. Degraded keeps the HTTP status 200: ingest itself is not affected.
/// </summary>
internal sealed class ReminderCoverageHealthCheck(IDashboardQueries queries, ReminderMonitor monitor) : IHealthCheck
{
    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var chambers = await queries.GetChambersAsync(cancellationToken).ConfigureAwait(false);
        var data = new Dictionary<string, object>(StringComparer.Ordinal);
        foreach (var chamber in chambers)
        {
            foreach (var u in monitor.Assess(chamber).NotWatched)
            {
                data[u.Chamber + "/" + u.Rule.Id] = "not watched on this chamber: " + u.Reason;
            }
        }
        return data.Count == 0
            ? HealthCheckResult.Healthy($"every reminder is watched on {chambers.Count} chamber(s)")
            : HealthCheckResult.Degraded($"{data.Count} reminder(s) not watched on their chamber: they cannot show there", data: data);
    }
}
