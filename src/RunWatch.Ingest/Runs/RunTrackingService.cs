using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Pipeline;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// Resumes open runs at start, stores opened runs, evaluates and stores closed ones (retrying while the store
/// fails), and ticks the tracker's time rules every second.
/// </summary>
internal sealed class RunTrackingService(
    RunTracker tracker,
    RunEvaluator evaluator,
    IRunWatchStore store,
    ChamberRegistryHolder registry,
    IngestMetrics metrics,
    TimeProvider timeProvider,
    IOptions<FleetOptions> fleet,
    ILogger<RunTrackingService> logger) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        // In fleet mode a daemon resumes only the runs of the chambers it takes (ChamberOwnershipService).
        if (!fleet.Value.Enabled)
        {
            tracker.Resume(await store.GetOpenRunsAsync(stoppingToken).ConfigureAwait(false));
        }
        var ticks = TickAsync(stoppingToken);
        try
        {
            await foreach (var work in tracker.Work.ReadAllAsync(stoppingToken).ConfigureAwait(false))
            {
                await HandleAsync(work, stoppingToken).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
        await ticks.ConfigureAwait(false);
    }

    private async Task TickAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(TimeSpan.FromSeconds(1), timeProvider);
        try
        {
            while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
            {
                tracker.Tick(timeProvider.GetUtcNow());
                metrics.RunsOpen.Set(tracker.OpenCount);
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
    }

    private async Task HandleAsync(RunWork work, CancellationToken stoppingToken)
    {
        var delay = TimeSpan.FromMilliseconds(500);
        while (true)
        {
            try
            {
                var record = work.Run.Record with { Id = work.Run.Id };
                if (work.Close)
                {
                    var chamber = registry.Registry.All.FirstOrDefault(c => c.Name == record.Chamber);
                    if (chamber is not null)
                    {
                        try
                        {
                            record = await evaluator.EvaluateAsync(record, chamber, stoppingToken).ConfigureAwait(false);
                        }
                        catch (ArgumentException ex)
                        {
                            // The record cannot be evaluated (e.g. invalid process parameters): store the run closed, say why.
                            record = record with { Summary = RunThermalSummary.Failed(ex.Message) };
                        }
                    }
                }
                var saved = await store.SaveRunAsync(record, stoppingToken).ConfigureAwait(false);
                work.Run.Id = saved.Id;
                if (work.Close)
                {
                    Log.RunClosed(logger, saved.Name, saved.Chamber, saved.EndReason?.ToString() ?? "", saved.LEffNm, saved.LNomNm, saved.TEffC, saved.Coverage * 100);
                }
                return;
            }
            catch (StoreUnavailableException ex)
            {
                Log.RunStoreFailed(logger, work.Run.Record.Name, ex);
                await Task.Delay(delay, timeProvider, stoppingToken).ConfigureAwait(false);
                delay = TimeSpan.FromTicks(Math.Min(delay.Ticks * 2, TimeSpan.FromSeconds(30).Ticks));
            }
        }
    }
}
