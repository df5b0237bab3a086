using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Storage;

namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// Runs first at host start: migrates the store and registers the configured chambers, so every later service finds
/// the registry ready. A store that cannot be opened stops the start with a clear error.
/// </summary>
internal sealed class StoreStartupService(
    IRunWatchStore store,
    IOptions<ChambersOptions> chambers,
    ChamberRegistryHolder holder,
    ILogger<StoreStartupService> logger) : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        await store.MigrateAsync(cancellationToken).ConfigureAwait(false);
        var items = chambers.Value.Items;
        var registered = await store.RegisterChambersAsync(ChamberRegistry.ToDefinitions(items), cancellationToken).ConfigureAwait(false);
        holder.Set(new ChamberRegistry(items, registered));
        Log.ChambersRegistered(logger, items.Count);
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}
