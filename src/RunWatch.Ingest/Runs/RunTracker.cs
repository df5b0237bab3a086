using System.Globalization;
using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Pipeline;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// Finds runs in committed data: from run-start/run-end events, or (chambers in shutter mode) from the growth-shutter
/// channel, and closes runs that never end by the timeout rule. Quick and non-blocking: storing and evaluating a run
/// is queued for <see cref="RunTrackingService"/>. Thread-safe (one lock; called by the committer and by ticks).
/// </summary>
internal sealed class RunTracker : ICommittedBatchObserver
{
    private readonly Lock _gate = new();
    private readonly ChamberRegistryHolder _registry;
    private readonly IReadOnlyList<IRunLifecycleListener> _listeners;
    private readonly ILogger _logger;
    private readonly Channel<RunWork> _work = Channel.CreateUnbounded<RunWork>(new UnboundedChannelOptions { SingleReader = true });
    private readonly Dictionary<long, TrackedRun> _open = [];
    private readonly Dictionary<long, long> _lastSampleUs = [];

    public RunTracker(ChamberRegistryHolder registry, IEnumerable<IRunLifecycleListener> listeners, ILogger<RunTracker> logger)
    {
        _registry = registry;
        _listeners = [.. listeners];
        _logger = logger;
    }

    public ChannelReader<RunWork> Work => _work.Reader;

    public int OpenCount
    {
        get
        {
            lock (_gate)
            {
                return _open.Count;
            }
        }
    }

    /// <summary>The open run of a chamber, if any (a copy of its record).</summary>
    public RunRecord? OpenRun(long chamberId)
    {
        lock (_gate)
        {
            return _open.TryGetValue(chamberId, out var run) ? run.Record : null;
        }
    }

    /// <summary>Resumes runs left open by a previous process.</summary>
    public void Resume(IReadOnlyList<RunRecord> openRuns)
    {
        lock (_gate)
        {
            foreach (var record in openRuns)
            {
                var chamber = _registry.Registry.All.FirstOrDefault(c => c.Name == record.Chamber);
                if (chamber is null || _open.ContainsKey(chamber.ChamberId))
                {
                    continue;
                }
                _open[chamber.ChamberId] = new TrackedRun(record);
                if (record.LastSampleAt is { } last)
                {
                    _lastSampleUs[chamber.ChamberId] = UnixMicros.From(last);
                }
                foreach (var listener in _listeners)
                {
                    listener.RunStarted(chamber.ChamberId, UnixMicros.From(record.StartedAt), record.SetpointC);
                }
            }
        }
    }

    /// <summary>
    /// Drops a chamber's tracking without closing its run (fleet mode: another daemon now owns the chamber and
    /// resumes the open run from the store).
    /// </summary>
    public void Forget(long chamberId)
    {
        lock (_gate)
        {
            _open.Remove(chamberId);
            _lastSampleUs.Remove(chamberId);
        }
    }

    public void OnCommitted(IngestBatch batch, IReadOnlyList<ChamberEvent> events, DateTimeOffset committedAt)
    {
        var registry = _registry.Registry;
        lock (_gate)
        {
            foreach (var e in events)
            {
                if (registry.Find(e.ChamberId) is { } chamber && chamber.Options.Runs.Mode == RunDetectionMode.Events)
                {
                    OnEvent(chamber, e);
                }
            }
            var samples = batch.Samples;
            var inserted = batch.Inserted;
            ChamberRuntime? current = null;
            for (int i = 0; i < samples.Length; i++)
            {
                if (!inserted[i])
                {
                    continue;
                }
                ref readonly var s = ref samples[i];
                if (current is null || current.ChamberId != s.ChamberId)
                {
                    current = registry.Find(s.ChamberId);
                    if (current is null)
                    {
                        continue;
                    }
                }
                if (!_lastSampleUs.TryGetValue(s.ChamberId, out long last) || s.TimestampUs > last)
                {
                    _lastSampleUs[s.ChamberId] = s.TimestampUs;
                }
                if (current.Options.Runs.Mode == RunDetectionMode.Shutter && current.GrowthShutter?.ChannelId == s.ChannelId)
                {
                    OnShutter(current, s.TimestampUs, s.Value);
                }
            }
        }
    }

    /// <summary>Applies the time rules: shutter debounce and the timeout of runs that never end.</summary>
    public void Tick(DateTimeOffset now)
    {
        long nowUs = UnixMicros.From(now);
        lock (_gate)
        {
            foreach (var (chamberId, run) in _open.ToArray())
            {
                var chamber = _registry.Registry.Find(chamberId);
                if (chamber is null)
                {
                    continue;
                }
                var rules = chamber.Options.Runs;
                if (run.ShutterClosedSinceUs is { } closedUs && nowUs - closedUs >= Micros(rules.ShutterCloseDebounce))
                {
                    Close(chamber, run, closedUs, RunEndReason.ShutterClosed);
                    continue;
                }
                long startUs = UnixMicros.From(run.Record.StartedAt);
                long deadlineUs = run.Record.PlannedSeconds is { } planned
                    ? startUs + (long)(planned * rules.PlannedTimeoutFactor * 1e6) + Micros(rules.TimeoutGrace)
                    : startUs + Micros(rules.MaxRunDuration);
                long lastUs = _lastSampleUs.TryGetValue(chamberId, out long l) && l >= startUs ? l : startUs;
                if (nowUs >= deadlineUs)
                {
                    Close(chamber, run, Math.Min(deadlineUs, Math.Max(lastUs, startUs)), RunEndReason.Timeout);
                }
                else if (nowUs - lastUs >= Micros(rules.NoTelemetryTimeout))
                {
                    Close(chamber, run, lastUs, RunEndReason.Timeout);
                }
            }
        }
    }

    private void OnEvent(ChamberRuntime chamber, ChamberEvent e)
    {
        long t = UnixMicros.From(e.Timestamp);
        _open.TryGetValue(chamber.ChamberId, out var open);
        if (e.Type == "run-start")
        {
            if (open is not null)
            {
                if (open.Record.Name == e.RunName && open.Record.StartedAt == e.Timestamp)
                {
                    return;
                }
                Close(chamber, open, t, RunEndReason.Superseded);
            }
            string name = e.RunName ?? AutoName(chamber, e.Timestamp);
            Open(chamber, new RunRecord
            {
                Chamber = chamber.Name, Name = name, Source = RunSource.Events, Status = RunStatus.Open, StartedAt = e.Timestamp,
                Recipe = e.Recipe, Wafers = e.Wafers, SetpointC = e.SetpointC, PlannedSeconds = e.PlannedSeconds,
            });
        }
        else if (e.Type == "run-end" && open is not null && (e.RunName is null || e.RunName == open.Record.Name) && t >= UnixMicros.From(open.Record.StartedAt))
        {
            Close(chamber, open, t, RunEndReason.EndEvent);
        }
    }

    private void OnShutter(ChamberRuntime chamber, long timestampUs, double value)
    {
        var rules = chamber.Options.Runs;
        bool isOpen = value >= rules.ShutterOpenAtOrAbove;
        _open.TryGetValue(chamber.ChamberId, out var run);
        if (run is null)
        {
            if (isOpen)
            {
                var start = UnixMicros.ToDateTimeOffset(timestampUs);
                Open(chamber, new RunRecord
                {
                    Chamber = chamber.Name, Name = AutoName(chamber, start), Source = RunSource.Shutter, Status = RunStatus.Open, StartedAt = start,
                });
            }
            return;
        }
        if (isOpen)
        {
            run.ShutterClosedSinceUs = null;
        }
        else if (run.ShutterClosedSinceUs is null)
        {
            run.ShutterClosedSinceUs = timestampUs;
        }
        else if (timestampUs - run.ShutterClosedSinceUs.Value >= Micros(rules.ShutterCloseDebounce))
        {
            Close(chamber, run, run.ShutterClosedSinceUs.Value, RunEndReason.ShutterClosed);
        }
    }

    private void Open(ChamberRuntime chamber, RunRecord record)
    {
        var run = new TrackedRun(record);
        _open[chamber.ChamberId] = run;
        _work.Writer.TryWrite(new RunWork(run, Close: false));
        Log.RunStarted(_logger, record.Name, chamber.Name, record.Source.ToString());
        foreach (var listener in _listeners)
        {
            listener.RunStarted(chamber.ChamberId, UnixMicros.From(record.StartedAt), record.SetpointC);
        }
    }

    private void Close(ChamberRuntime chamber, TrackedRun run, long endUs, RunEndReason reason)
    {
        _open.Remove(chamber.ChamberId);
        long? last = _lastSampleUs.TryGetValue(chamber.ChamberId, out long l) ? l : null;
        run.Record = run.Record with
        {
            Status = RunStatus.Closed,
            EndReason = reason,
            EndedAt = UnixMicros.ToDateTimeOffset(Math.Max(endUs, UnixMicros.From(run.Record.StartedAt))),
            LastSampleAt = last is { } lastUs ? UnixMicros.ToDateTimeOffset(lastUs) : run.Record.LastSampleAt,
        };
        _work.Writer.TryWrite(new RunWork(run, Close: true));
        foreach (var listener in _listeners)
        {
            listener.RunEnded(chamber.ChamberId, endUs);
        }
    }

    private static string AutoName(ChamberRuntime chamber, DateTimeOffset start) =>
        chamber.Name + "-" + start.UtcDateTime.ToString("yyyyMMdd-HHmmss", CultureInfo.InvariantCulture);

    private static long Micros(TimeSpan span) => span.Ticks / TimeSpan.TicksPerMicrosecond;
}
