using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Chambers;
using RunWatch.Storage;
using RunWatch.Storage.Postgres;

namespace RunWatch.Ingest.Fleet;

/// <summary>
/// <c>/healthz</c> "fleet": this instance's name, the chambers it owns, and every chamber's owner as the database's
/// lock table shows it (a chamber nobody owns is listed with owner "none": its messages wait at the broker).
/// </summary>
internal sealed class FleetHealthCheck(FleetState fleet, ChamberRegistryHolder registry, IOptions<StorageOptions> storage) : IHealthCheck
{
    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        var data = new Dictionary<string, object> { ["instance"] = fleet.Instance };
        if (!registry.IsReady)
        {
            return HealthCheckResult.Degraded("starting", data: data);
        }
        var chambers = registry.Registry.All;
        // Owned = locked, state rebuilt and subscribed (a chamber still being taken over is not listed yet).
        data["owned"] = chambers.Where(c => fleet.OwnedSince.ContainsKey(c.Name)).Select(c => c.Name).ToArray();
        try
        {
            var owners = await ChamberOwnershipSession.ReadOwnersAsync(storage.Value.ConnectionString!, cancellationToken).ConfigureAwait(false);
            data["owners"] = chambers.Select(c => c.Name + "=" + (owners.FirstOrDefault(o => o.ChamberId == c.ChamberId)?.Instance ?? "none")).ToArray();
            int unowned = chambers.Count(c => owners.All(o => o.ChamberId != c.ChamberId));
            return unowned == 0
                ? HealthCheckResult.Healthy("every chamber has an owner", data)
                : HealthCheckResult.Degraded(unowned + " chamber(s) without an owner", data: data);
        }
        catch (StoreUnavailableException ex)
        {
            return HealthCheckResult.Degraded("cannot read the fleet's owners: " + ex.Message, data: data);
        }
    }
}
