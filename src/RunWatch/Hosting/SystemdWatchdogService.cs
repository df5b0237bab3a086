using System.Globalization;
using Microsoft.Extensions.Hosting.Systemd;
using RunWatch.Ingest.Health;

namespace RunWatch.Hosting;

/// <summary>
/// Pings the systemd watchdog at half its interval (<c>WATCHDOG_USEC</c>) while the committer is alive: when
/// messages wait and nothing has been committed or attempted for a whole interval, the pings stop and systemd
/// restarts the service. Registered only under systemd.
/// </summary>
internal sealed class SystemdWatchdogService(ISystemdNotifier notifier, IngestHealth health, TimeProvider timeProvider) : BackgroundService
{
    private static readonly ServiceState Watchdog = new("WATCHDOG=1");

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (!notifier.IsEnabled || !long.TryParse(Environment.GetEnvironmentVariable("WATCHDOG_USEC"), NumberStyles.None, CultureInfo.InvariantCulture, out long usec) || usec <= 0)
        {
            return;
        }
        var interval = TimeSpan.FromMicroseconds(usec);
        using var timer = new PeriodicTimer(interval / 2, timeProvider);
        while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
        {
            var s = health.Snapshot();
            bool wedged = s.QueueDepth > 0 && s.StoreWritable && s.LastCommitAt is { } last && timeProvider.GetUtcNow() - last > interval;
            if (!wedged)
            {
                notifier.Notify(Watchdog);
            }
        }
    }
}
