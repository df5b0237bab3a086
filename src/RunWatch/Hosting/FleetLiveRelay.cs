using RunWatch.Storage;
using RunWatch.Storage.Postgres;
using RunWatch.Web.Data;
using RunWatch.Web.Live;

namespace RunWatch.Hosting;

/// <summary>
/// On a PostgreSQL store: pushes samples that other daemons of the fleet commit to this instance's open dashboard
/// pages, through the store's LISTEN/NOTIFY. Samples this daemon commits itself reach the pages through
/// <see cref="DashboardLiveBridge"/>; the listener skips this store's own notifications. Idle on SQLite.
/// </summary>
internal sealed class FleetLiveRelay(IServiceProvider services, ITelemetryNotifier notifier, TimeProvider timeProvider, ILogger<PostgresCommitListener> logger)
    : BackgroundService
{
    protected override Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (services.GetService<PostgresRunWatchStore>() is not { } store)
        {
            return Task.CompletedTask;
        }
        var listener = new PostgresCommitListener(store, timeProvider, logger);
        return listener.RunAsync(Push, stoppingToken);
    }

    private void Push(CommittedSamples committed)
    {
        var live = new LiveSample[committed.Samples.Count];
        for (int i = 0; i < live.Length; i++)
        {
            SampleRecord s = committed.Samples[i];
            live[i] = new LiveSample(committed.Chamber, committed.Channel, s.Timestamp, s.Value);
        }
        notifier.SamplesCommitted(live);
    }
}
