using System.Diagnostics;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Alerts;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Pipeline;
using RunWatch.Ingest.Runs;
using RunWatch.Storage;
using RunWatch.Storage.Postgres;

namespace RunWatch.Ingest.Fleet;

/// <summary>
/// Fleet mode: holds this daemon's chamber ownership locks (<see cref="ChamberOwnershipSession"/>) and, for each
/// chamber it owns, the chamber's MQTT session. Every <see cref="FleetOptions.ClaimInterval"/> it asks the server
/// which locks it still holds (a lost chamber's session is closed at once and its tracking dropped), then tries to
/// take every free chamber: on success it first rebuilds the chamber's state from the store (open run, active
/// alerts) and only then subscribes, so nothing is processed against stale state. Builds no consensus of its own:
/// the server's lock table decides, and the broker's persistent session carries the messages across.
/// </summary>
internal sealed class ChamberOwnershipService(
    IOptions<FleetOptions> fleetOptions,
    IOptions<StorageOptions> storageOptions,
    IOptions<BrokerOptions> brokerOptions,
    IOptions<IngestOptions> ingestOptions,
    ChamberRegistryHolder registry,
    FleetState fleet,
    InboundQueue queue,
    IRunWatchStore store,
    RunTracker tracker,
    AlertEngine engine,
    AlertDispatchService alerts,
    TimeProvider timeProvider,
    ILogger<ChamberOwnershipService> logger) : BackgroundService
{
    private ChamberOwnershipSession? _session;

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        await base.StopAsync(cancellationToken).ConfigureAwait(false);
        // The committer has stopped and acknowledged what it committed (it stops before this service): leave every
        // chamber's broker session for the next owner, then end the database session, which frees the locks.
        foreach (long chamberId in fleet.OwnedChamberIds)
        {
            if (fleet.Remove(chamberId) is { } session)
            {
                await session.DisposeAsync().ConfigureAwait(false);
            }
        }
        if (_session is not null)
        {
            await _session.DisposeAsync().ConfigureAwait(false);
        }
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var options = fleetOptions.Value;
        string instance = brokerOptions.Value.InstanceName;
        fleet.Instance = instance;
        _session = new ChamberOwnershipSession(storageOptions.Value.ConnectionString!, instance, options.LockKeepAlive, options.LockCommandTimeout);
        using var timer = new PeriodicTimer(options.ClaimInterval, timeProvider);
        do
        {
            try
            {
                await CheckAndClaimAsync(_session, instance, stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                return;
            }
            catch (StoreUnavailableException ex)
            {
                FleetLog.OwnershipCheckFailed(logger, ex.Message, fleet.OwnedChamberIds.Count);
                await DropLostAsync([], instance).ConfigureAwait(false);
            }
        }
        while (await WaitAsync(timer, stoppingToken).ConfigureAwait(false));
    }

    private static async Task<bool> WaitAsync(PeriodicTimer timer, CancellationToken stoppingToken)
    {
        try
        {
            return await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false);
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            return false;
        }
    }

    private async Task CheckAndClaimAsync(ChamberOwnershipSession session, string instance, CancellationToken stoppingToken)
    {
        var held = await session.VerifyAsync(stoppingToken).ConfigureAwait(false);
        await DropLostAsync(held, instance).ConfigureAwait(false);
        int limit = fleetOptions.Value.MaxOwnedChambers;
        foreach (var chamber in registry.Registry.All)
        {
            if (limit > 0 && fleet.OwnedChamberIds.Count >= limit)
            {
                return;
            }
            if (fleet.Owns(chamber.ChamberId) || !await session.TryAcquireAsync(chamber.ChamberId, stoppingToken).ConfigureAwait(false))
            {
                continue;
            }
            try
            {
                await TakeOverAsync(chamber, instance, stoppingToken).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is not OperationCanceledException and not OutOfMemoryException)
            {
                // A chamber half taken (store or broker unreachable) is given back whole; another daemon, or this
                // one at the next tick, tries again.
                FleetLog.TakeoverFailed(logger, chamber.Name, ex.Message);
                if (fleet.Remove(chamber.ChamberId) is { } partial)
                {
                    await partial.DisposeAsync().ConfigureAwait(false);
                }
                tracker.Forget(chamber.ChamberId);
                engine.Forget(chamber.ChamberId);
                await session.ReleaseAsync(chamber.ChamberId, stoppingToken).ConfigureAwait(false);
            }
        }
    }

    private async Task TakeOverAsync(ChamberRuntime chamber, string instance, CancellationToken stoppingToken)
    {
        var clock = Stopwatch.StartNew();
        var openRuns = (await store.GetOpenRunsAsync(stoppingToken).ConfigureAwait(false)).Where(r => r.Chamber == chamber.Name).ToList();
        // Replay from the open run's start (else a fixed window): the alert state of everything the previous owner
        // committed is rebuilt, whether or not it lived to record the alerts.
        var now = timeProvider.GetUtcNow();
        var replayFrom = openRuns.Count > 0 ? openRuns[0].StartedAt : now - fleetOptions.Value.ReplayWindow;
        int activeAlerts = await alerts.ReloadChamberAsync(chamber.Name, replayFrom, stoppingToken).ConfigureAwait(false);
        var replay = await ReadReplayAsync(chamber, replayFrom, now + ingestOptions.Value.MaxFutureSkew, stoppingToken).ConfigureAwait(false);
        tracker.Forget(chamber.ChamberId);
        engine.Forget(chamber.ChamberId);
        tracker.Resume(openRuns);
        engine.Replay(chamber.ChamberId, replay);
        var session = new ChamberMqttSession(chamber, fleetOptions.Value.ClientIdFor(chamber.Site, chamber.Name), brokerOptions.Value, ingestOptions.Value, queue, logger);
        fleet.Add(session);
        await session.StartAsync(stoppingToken).ConfigureAwait(false);
        fleet.OwnedSince[chamber.Name] = timeProvider.GetUtcNow();
        FleetLog.ChamberTakenOver(logger, chamber.Name, instance, openRuns.Count, activeAlerts, replay.Count, clock.ElapsedMilliseconds);
    }

    /// <summary>The stored growth temperature and setpoint samples of the chamber in [from, to), merged in time order.</summary>
    private async Task<List<SampleRow>> ReadReplayAsync(ChamberRuntime chamber, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken)
    {
        var rows = new List<SampleRow>();
        int limit = fleetOptions.Value.ReplayMaxSamples;
        foreach (var channel in new[] { chamber.Setpoint, chamber.GrowthTemperature })
        {
            if (channel is null)
            {
                continue;
            }
            foreach (var sample in await store.GetSamplesAsync(chamber.Name, channel.Name, from, to, limit, cancellationToken).ConfigureAwait(false))
            {
                rows.Add(new SampleRow(chamber.ChamberId, channel.ChannelId, UnixMicros.From(sample.Timestamp), sample.Seq, sample.Value));
            }
        }
        // Setpoint before temperature at equal times, as a message carrying both is applied.
        long setpointId = chamber.Setpoint?.ChannelId ?? -1;
        rows.Sort((a, b) => a.TimestampUs != b.TimestampUs ? a.TimestampUs.CompareTo(b.TimestampUs) : (b.ChannelId == setpointId).CompareTo(a.ChannelId == setpointId));
        return rows;
    }

    private async Task DropLostAsync(IReadOnlyCollection<long> held, string instance)
    {
        foreach (long chamberId in fleet.OwnedChamberIds)
        {
            if (held.Contains(chamberId) || fleet.Remove(chamberId) is not { } session)
            {
                continue;
            }
            await session.DisposeAsync().ConfigureAwait(false);
            tracker.Forget(chamberId);
            engine.Forget(chamberId);
            FleetLog.ChamberLost(logger, session.Chamber.Name, instance);
        }
    }
}
