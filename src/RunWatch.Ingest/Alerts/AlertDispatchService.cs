using System.Threading.Channels;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Pipeline;
using RunWatch.Storage;

namespace RunWatch.Ingest.Alerts;

/// <summary>
/// Turns alarm signals into stored alert records (lifecycle in <see cref="AlertBook"/>) and hands each change to the
/// sinks, each through its own bounded queue. Records that cannot be saved (store down) are kept and saved later.
/// Ticks the alert engine every second (stale telemetry, shelve expiry). Implements the operator commands.
/// </summary>
internal sealed class AlertDispatchService : BackgroundService, IAlertCommands
{
    private readonly AlertEngine _engine;
    private readonly IRunWatchStore _store;
    private readonly IReadOnlyList<IAlertSink> _sinks;
    private readonly IngestMetrics _metrics;
    private readonly TimeProvider _timeProvider;
    private readonly ILogger _logger;
    private readonly AlertBook _book = new();
    private readonly Lock _bookGate = new();
    private readonly SemaphoreSlim _saveGate = new(1, 1);
    private readonly Dictionary<string, AlertRecord> _unsaved = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> _pendingUser = new(StringComparer.Ordinal);
    private readonly Dictionary<string, DateTimeOffset> _lookForRun = new(StringComparer.Ordinal);
    private readonly AlertJournal _journal;

    public AlertDispatchService(AlertEngine engine, IRunWatchStore store, IEnumerable<IAlertSink> sinks, IOptions<AlertsOptions> options,
        IOptions<StorageOptions> storage, IngestMetrics metrics, TimeProvider timeProvider, ILogger<AlertDispatchService> logger)
    {
        _journal = new AlertJournal(Path.Combine(Path.GetFullPath(storage.Value.DataDirectory), AlertJournal.FileName));
        _engine = engine;
        _store = store;
        var o = options.Value;
        _sinks = [.. sinks.Where(s => s.Name switch { "mqtt" => o.PublishToMqtt, "log" => o.Log, "webhook" => !string.IsNullOrEmpty(o.WebhookUrl), _ => true })];
        _metrics = metrics;
        _timeProvider = timeProvider;
        _logger = logger;
    }

    public async Task<bool> AcknowledgeAsync(long alertId, string user, string? comment, CancellationToken cancellationToken)
    {
        var alert = await _store.GetAlertAsync(alertId, cancellationToken).ConfigureAwait(false);
        if (alert is null || alert.State is AlertState.Normal or AlertState.Acknowledged or AlertState.Suppressed)
        {
            return false;
        }
        lock (_bookGate)
        {
            _pendingUser[alert.Key] = user;
        }
        bool changed = alert.Chamber is null ? AcknowledgeStore() : _engine.Acknowledge(alert.Chamber, alert.Kind);
        if (changed)
        {
            await _store.AppendAuditAsync(new AuditEntry(_timeProvider.GetUtcNow(), user, "alert-acknowledged", alertId.ToString(System.Globalization.CultureInfo.InvariantCulture),
                AuditJson(comment, null)), cancellationToken).ConfigureAwait(false);
        }
        return changed;
    }

    /// <summary>
    /// Replaces the book's alerts of one chamber with the store's (fleet mode, at a takeover: the previous owner may
    /// have raised, acknowledged or cleared them since this daemon last looked). Returns how many are active.
    /// </summary>
    public async Task<int> ReloadChamberAsync(string chamber, DateTimeOffset replayFrom, CancellationToken cancellationToken)
    {
        var active = (await _store.GetActiveAlertsAsync(cancellationToken).ConfigureAwait(false)).Where(a => a.Chamber == chamber).ToList();
        var recent = (await _store.GetAlertHistoryAsync(replayFrom.AddDays(-1), DateTimeOffset.MaxValue, 10_000, cancellationToken).ConfigureAwait(false))
            .Where(a => a.Chamber == chamber).ToList();
        lock (_bookGate)
        {
            _book.Replace(chamber, active, recent.Concat(active));
        }
        _metrics.AlertsActive.Set(ActiveCount());
        return active.Count;
    }

    public async Task<bool> ShelveAsync(long alertId, TimeSpan duration, string user, string? comment, CancellationToken cancellationToken)
    {
        var alert = await _store.GetAlertAsync(alertId, cancellationToken).ConfigureAwait(false);
        // Shelving is an operator's choice for a raised alert; a condition suppressed by design is not raised.
        if (alert is null || alert.Chamber is null || alert.State is AlertState.Normal or AlertState.Suppressed)
        {
            return false;
        }
        bool changed = _engine.Shelve(alert.Chamber, alert.Kind, duration);
        if (changed)
        {
            await _store.AppendAuditAsync(new AuditEntry(_timeProvider.GetUtcNow(), user, "alert-shelved", alertId.ToString(System.Globalization.CultureInfo.InvariantCulture),
                AuditJson(comment, (long)duration.TotalSeconds)), cancellationToken).ConfigureAwait(false);
        }
        return changed;
    }

    /// <summary>The audit detail of one operator action: the comment as <c>detail</c> and, for a shelve, its length in <c>seconds</c>.</summary>
    private static string? AuditJson(string? comment, long? seconds)
    {
        if (string.IsNullOrWhiteSpace(comment) && seconds is null)
        {
            return null;
        }
        var buffer = new System.Buffers.ArrayBufferWriter<byte>();
        using (var writer = new System.Text.Json.Utf8JsonWriter(buffer))
        {
            writer.WriteStartObject();
            if (!string.IsNullOrWhiteSpace(comment))
            {
                writer.WriteString("detail", comment);
            }
            if (seconds is { } s)
            {
                writer.WriteNumber("seconds", s);
            }
            writer.WriteEndObject();
        }
        return System.Text.Encoding.UTF8.GetString(buffer.WrittenSpan);
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        try
        {
            var active = await _store.GetActiveAlertsAsync(stoppingToken).ConfigureAwait(false);
            lock (_bookGate)
            {
                _book.Load(active);
            }
        }
        catch (StoreUnavailableException)
        {
            // Start with an empty book; alerts raised now are saved once the store is back.
        }
        await ReplayJournalAsync(stoppingToken).ConfigureAwait(false);
        var queues = _sinks.Select(sink => (Sink: sink, Queue: Channel.CreateBounded<AlertNotification>(new BoundedChannelOptions(1000) { FullMode = BoundedChannelFullMode.DropOldest }))).ToArray();
        var workers = queues.Select(q => RunSinkAsync(q.Sink, q.Queue.Reader, stoppingToken)).ToArray();
        var ticks = TickAsync(stoppingToken);
        try
        {
            await foreach (var signal in _engine.Signals.ReadAllAsync(stoppingToken).ConfigureAwait(false))
            {
                AlertNotification? notification = null;
                lock (_bookGate)
                {
                    _pendingUser.Remove(signal.Key, out string? user);
                    if (_book.Apply(signal, user) is { } change)
                    {
                        _unsaved[change.Alert.Key] = change.Alert;
                        notification = new AlertNotification(change.Alert, change.Change, signal.Site);
                    }
                }
                if (notification is null)
                {
                    continue;
                }
                // Stored before published: on disk first (survives a kill while the store is down), then in the store.
                if (!_journal.TryAppend(notification.Alert))
                {
                    Log.AlertJournalFailed(_logger, notification.Alert.Kind, _journal.Path);
                }
                var saved = await SaveUnsavedAsync(stoppingToken).ConfigureAwait(false);
                if (saved.TryGetValue(notification.Alert.Key, out var withId))
                {
                    notification = notification with { Alert = withId };
                }
                // A condition suppressed by design is recorded in the store only: it is never raised to the sinks.
                if (notification.Change is not (AlertBook.SuppressedChange or AlertBook.SuppressionEndedChange))
                {
                    foreach (var (_, queue) in queues)
                    {
                        queue.Writer.TryWrite(notification);
                    }
                }
                _metrics.AlertsActive.Set(ActiveCount());
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
        foreach (var (_, queue) in queues)
        {
            queue.Writer.TryComplete();
        }
        await Task.WhenAll(workers).ConfigureAwait(false);
        await ticks.ConfigureAwait(false);
    }

    private int ActiveCount()
    {
        lock (_bookGate)
        {
            return _book.Current.Values.Count(a => a.State != AlertState.Suppressed);
        }
    }

    private bool AcknowledgeStore()
    {
        _engine.AcknowledgeStoreAlert();
        return true;
    }

    /// <summary>
    /// Alert changes journalled but not stored when the daemon last stopped (killed during a store outage) go back into
    /// the unsaved set; one already inserted before the kill is matched by key and raise time, so it is not stored twice.
    /// </summary>
    private async Task ReplayJournalAsync(CancellationToken cancellationToken)
    {
        var pending = _journal.ReadPending();
        if (pending.Count == 0)
        {
            return;
        }
        IReadOnlyList<AlertRecord> active = [];
        try
        {
            active = await _store.GetActiveAlertsAsync(cancellationToken).ConfigureAwait(false);
        }
        catch (StoreUnavailableException)
        {
            // Matched when saved later: a duplicate row is the worse case than none.
        }
        lock (_bookGate)
        {
            foreach (var alert in pending)
            {
                var toSave = alert;
                if (alert.Id == 0 && active.FirstOrDefault(a => a.Key == alert.Key && a.RaisedAt == alert.RaisedAt) is { } stored)
                {
                    toSave = alert with { Id = stored.Id, RunId = alert.RunId ?? stored.RunId };
                }
                _unsaved[alert.Key] = toSave;
                _book.Update(toSave);
            }
        }
        Log.AlertJournalReplayed(_logger, pending.Count);
        await SaveUnsavedAsync(cancellationToken).ConfigureAwait(false);
    }

    private async Task<Dictionary<string, AlertRecord>> SaveUnsavedAsync(CancellationToken cancellationToken)
    {
        // One save pass at a time: the signal loop and the retry tick both call this, and two passes over the same
        // new record (id 0) would insert it twice.
        await _saveGate.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            return await SaveUnsavedOnceAsync(cancellationToken).ConfigureAwait(false);
        }
        finally
        {
            _saveGate.Release();
        }
    }

    private async Task<Dictionary<string, AlertRecord>> SaveUnsavedOnceAsync(CancellationToken cancellationToken)
    {
        var saved = new Dictionary<string, AlertRecord>(StringComparer.Ordinal);
        KeyValuePair<string, AlertRecord>[] pending;
        lock (_bookGate)
        {
            pending = [.. _unsaved];
        }
        foreach (var (key, alert) in pending)
        {
            try
            {
                var toSave = alert;
                if (alert.Id == 0 && alert.RunId is null && alert.Chamber is { } chamber)
                {
                    toSave = alert with { RunId = await RunDuringAsync(chamber, alert.RaisedAt, cancellationToken).ConfigureAwait(false) };
                }
                var stored = await _store.SaveAlertAsync(toSave, cancellationToken).ConfigureAwait(false);
                if (alert.Id == 0 && stored.RunId is null && stored.Chamber is not null)
                {
                    lock (_bookGate)
                    {
                        _lookForRun[key] = _timeProvider.GetUtcNow() + TimeSpan.FromMinutes(2);
                    }
                }
                saved[key] = stored;
                lock (_bookGate)
                {
                    // Keep the id for later changes of the same alert; drop the pending copy unless a newer one replaced it.
                    if (_unsaved.TryGetValue(key, out var current) && ReferenceEquals(current, alert))
                    {
                        _unsaved.Remove(key);
                    }
                    else if (current is not null)
                    {
                        _unsaved[key] = current with { Id = stored.Id, RunId = stored.RunId };
                    }
                    if (_book.Current.TryGetValue(key, out var inBook) && inBook.Id == 0)
                    {
                        _book.Update(inBook with { Id = stored.Id, RunId = stored.RunId });
                    }
                }
            }
            catch (StoreUnavailableException ex)
            {
                Log.AlertStoreFailed(_logger, alert.Kind, alert.Chamber ?? "daemon", ex);
                break;
            }
        }
        bool allStored;
        lock (_bookGate)
        {
            allStored = _unsaved.Count == 0;
        }
        if (allStored)
        {
            _journal.Clear();
        }
        return saved;
    }

    /// <summary>
    /// An alert raised in the first moments of a run can be saved before the run tracker has stored the run; for two
    /// minutes after its first save, a chamber alert without a run looks again each tick and, once the run is there,
    /// is saved with it.
    /// </summary>
    private async Task LinkRecentAlertsToRunsAsync(CancellationToken cancellationToken)
    {
        var now = _timeProvider.GetUtcNow();
        List<AlertRecord> candidates = [];
        lock (_bookGate)
        {
            foreach (var (key, until) in _lookForRun.ToArray())
            {
                if (until < now || !_book.Current.TryGetValue(key, out var inBook) || inBook.RunId is not null)
                {
                    _lookForRun.Remove(key);
                }
                else if (inBook.Id != 0 && !_unsaved.ContainsKey(key))
                {
                    candidates.Add(inBook);
                }
            }
        }
        foreach (var alert in candidates)
        {
            long? runId;
            try
            {
                runId = await RunDuringAsync(alert.Chamber!, alert.RaisedAt, cancellationToken).ConfigureAwait(false);
            }
            catch (StoreUnavailableException)
            {
                return;
            }
            if (runId is null)
            {
                continue;
            }
            lock (_bookGate)
            {
                if (_book.Current.TryGetValue(alert.Key, out var current) && current.Id == alert.Id && current.RunId is null)
                {
                    var linked = current with { RunId = runId };
                    _book.Update(linked);
                    _lookForRun.Remove(alert.Key);
                    _unsaved[alert.Key] = _unsaved.TryGetValue(alert.Key, out var pending) ? pending with { RunId = runId } : linked;
                }
            }
        }
    }

    /// <summary>The run the chamber was in when the alert was raised (started before it, not ended before it), if any.</summary>
    private async Task<long?> RunDuringAsync(string chamber, DateTimeOffset raisedAt, CancellationToken cancellationToken)
    {
        var runs = await _store.ListRunsAsync(chamber, raisedAt.AddTicks(10), 1, cancellationToken).ConfigureAwait(false);
        return runs.Count == 1 && (runs[0].EndedAt is null || runs[0].EndedAt >= raisedAt) ? runs[0].Id : null;
    }

    private async Task TickAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(TimeSpan.FromSeconds(1), _timeProvider);
        try
        {
            while (await timer.WaitForNextTickAsync(stoppingToken).ConfigureAwait(false))
            {
                _engine.Tick(_timeProvider.GetUtcNow());
                await LinkRecentAlertsToRunsAsync(stoppingToken).ConfigureAwait(false);
                bool retry;
                lock (_bookGate)
                {
                    retry = _unsaved.Count > 0;
                }
                if (retry)
                {
                    await SaveUnsavedAsync(stoppingToken).ConfigureAwait(false);
                }
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
    }

    private async Task RunSinkAsync(IAlertSink sink, ChannelReader<AlertNotification> queue, CancellationToken stoppingToken)
    {
        try
        {
            await foreach (var notification in queue.ReadAllAsync(stoppingToken).ConfigureAwait(false))
            {
                try
                {
                    await sink.SendAsync(notification, stoppingToken).ConfigureAwait(false);
                }
                catch (Exception ex) when (ex is not OperationCanceledException and not OutOfMemoryException)
                {
                    Log.AlertSinkFailed(_logger, sink.Name, notification.Alert.Id, ex);
                }
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
        }
    }
}
