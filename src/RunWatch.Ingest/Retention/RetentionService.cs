using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Storage;

namespace RunWatch.Ingest.Retention;

/// <summary>Checkpoints the store when ingest is idle and prunes old rows at the configured interval.</summary>
internal sealed class RetentionService(IRunWatchStore store, IOptions<RetentionOptions> options, TimeProvider timeProvider, ILogger<RetentionService> logger) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var o = options.Value;
        using var timer = new PeriodicTimer(o.MaintenanceInterval, timeProvider);
        long lastPrune = timeProvider.GetTimestamp();
        try
        {
            while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
            {
                try
                {
                    await store.MaintainAsync(stoppingToken).ConfigureAwait(false);
                    if (timeProvider.GetElapsedTime(lastPrune) >= o.PruneInterval)
                    {
                        lastPrune = timeProvider.GetTimestamp();
                        var now = timeProvider.GetUtcNow();
                        await store.PruneAsync(new RetentionPolicy(o.Samples is { } keep ? now - keep : DateTimeOffset.MinValue.AddYears(1970), now - o.DeadLetters, now - o.NormalAlerts), stoppingToken).ConfigureAwait(false);
                    }
                }
                catch (StoreUnavailableException ex)
                {
                    Log.RetentionFailed(logger, ex);
                }
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
    }
}
