using System.Globalization;
using System.Threading.Channels;
using RunWatch.Core.Excursions;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Pipeline;
using RunWatch.Ingest.Runs;
using RunWatch.Storage;

namespace RunWatch.Ingest.Alerts;

/// <summary>
/// Applies the Core excursion monitor live to each chamber's committed growth temperature (calibrated, against the
/// calibrated setpoint channel or the run's announced setpoint), ticks it for stale telemetry, and turns every
/// alarm transition and daemon-wide condition into an <see cref="AlertSignal"/> for the dispatcher.
/// Thread-safe: one lock around the monitors (committer, ticks and operator actions call in).
/// </summary>
internal sealed class AlertEngine(ChamberRegistryHolder registry, TimeProvider timeProvider) : ICommittedBatchObserver, IDaemonConditions, IRunLifecycleListener
{
    // Monitor time: seconds since 2020-01-01 keeps microsecond resolution in a double for centuries.
    private static readonly long EpochUs = UnixMicros.From(new DateTimeOffset(2020, 1, 1, 0, 0, 0, TimeSpan.Zero));

    private readonly Lock _gate = new();
    private readonly Dictionary<long, ChamberAlarms> _chambers = [];
    private readonly Channel<AlertSignal> _signals = Channel.CreateUnbounded<AlertSignal>(new UnboundedChannelOptions { SingleReader = true });
    private bool _storeDown;

    public ChannelReader<AlertSignal> Signals => _signals.Reader;

    public void OnCommitted(IngestBatch batch, IReadOnlyList<ChamberEvent> events, DateTimeOffset committedAt)
    {
        var samples = batch.Samples;
        var inserted = batch.Inserted;
        lock (_gate)
        {
            ChamberAlarms? alarms = null;
            for (int i = 0; i < samples.Length; i++)
            {
                if (!inserted[i])
                {
                    continue;
                }
                ref readonly var s = ref samples[i];
                if (alarms is null || alarms.Chamber.ChamberId != s.ChamberId)
                {
                    alarms = Get(s.ChamberId);
                    if (alarms is null)
                    {
                        continue;
                    }
                }
                Observe(alarms, s);
            }
            DrainAll();
        }
    }

    /// <summary>
    /// Fleet mode, at a takeover: feeds a chamber's fresh monitors the samples the previous owner already stored (in
    /// time order), so that an excursion it committed but died before recording is still raised, and one in progress
    /// goes on from the right state. Its signals are marked <see cref="AlertSignal.Replayed"/>.
    /// </summary>
    public void Replay(long chamberId, IReadOnlyList<SampleRow> samples)
    {
        lock (_gate)
        {
            if (Get(chamberId) is not { } alarms)
            {
                return;
            }
            for (int i = 0; i < samples.Count; i++)
            {
                Observe(alarms, samples[i]);
            }
            Drain(alarms, replayed: true);
        }
    }

    private static void Observe(ChamberAlarms alarms, in SampleRow s)
    {
        var chamber = alarms.Chamber;
        if (chamber.Setpoint?.ChannelId == s.ChannelId)
        {
            alarms.ChannelSetpointC = chamber.GrowthTemperature?.Calibration.ToTrueC(s.Value) ?? s.Value;
        }
        else if (chamber.GrowthShutter?.ChannelId == s.ChannelId)
        {
            // State-based alarming: an open growth shutter is the Growth state, where deviation alarms always apply.
            alarms.Monitor.SetGrowth(s.Value >= chamber.Options.Runs.ShutterOpenAtOrAbove, Seconds(s.TimestampUs));
        }
        else if (chamber.GrowthTemperature is { } temperature && temperature.ChannelId == s.ChannelId)
        {
            alarms.Monitor.Observe(Seconds(s.TimestampUs), temperature.Calibration.ToTrueC(s.Value), alarms.SetpointC);
        }
    }

    public void Tick(DateTimeOffset now)
    {
        double nowS = Seconds(UnixMicros.From(now));
        lock (_gate)
        {
            foreach (var alarms in _chambers.Values)
            {
                alarms.Monitor.Tick(nowS);
            }
            DrainAll();
        }
    }

    public void RunStarted(long chamberId, long timestampUs, double? setpointC)
    {
        lock (_gate)
        {
            if (Get(chamberId) is { } alarms)
            {
                alarms.RunSetpointC = setpointC ?? double.NaN;
                // Stale counts from the daemon's clock at the start: a run resumed after a restart gets a fresh grace period.
                alarms.Monitor.BeginRun(Math.Max(Seconds(timestampUs), Seconds(UnixMicros.From(timeProvider.GetUtcNow())) - 1));
                Drain(alarms);
            }
        }
    }

    public void RunEnded(long chamberId, long timestampUs)
    {
        lock (_gate)
        {
            if (Get(chamberId) is { } alarms)
            {
                alarms.Monitor.EndRun(Math.Max(Seconds(timestampUs), Seconds(UnixMicros.From(timeProvider.GetUtcNow()))));
                alarms.RunSetpointC = double.NaN;
                Drain(alarms);
            }
        }
    }

    /// <summary>Drops a chamber's live monitors (fleet mode: another daemon owns the chamber now), without signalling anything.</summary>
    public void Forget(long chamberId)
    {
        lock (_gate)
        {
            _chambers.Remove(chamberId);
        }
    }

    public void StoreUnavailable(string error)
    {
        lock (_gate)
        {
            if (_storeDown)
            {
                return;
            }
            _storeDown = true;
        }
        _signals.Writer.TryWrite(new AlertSignal(AlertKinds.StoreUnwritable, null, null, AlertKinds.StoreUnwritable, AlarmState.ActiveUnacknowledged,
            timeProvider.GetUtcNow(), double.NaN, "store cannot be written; telemetry is not being acknowledged: " + error));
    }

    public void StoreRecovered()
    {
        lock (_gate)
        {
            if (!_storeDown)
            {
                return;
            }
            _storeDown = false;
        }
        _signals.Writer.TryWrite(new AlertSignal(AlertKinds.StoreUnwritable, null, null, AlertKinds.StoreUnwritable, AlarmState.ReturnedToNormalUnacknowledged,
            timeProvider.GetUtcNow(), double.NaN, "store writable again; ingest resumed"));
    }

    /// <summary>Operator action on a chamber alarm; the resulting transition reaches the dispatcher as a signal.</summary>
    public bool Acknowledge(string chamber, string kindCode)
    {
        var kind = AlertKinds.Parse(kindCode);
        lock (_gate)
        {
            if (kind is null || Find(chamber) is not { } alarms)
            {
                return false;
            }
            bool changed = alarms.Monitor.Acknowledge(kind.Value, Seconds(UnixMicros.From(timeProvider.GetUtcNow())));
            Drain(alarms);
            return changed;
        }
    }

    public bool Shelve(string chamber, string kindCode, TimeSpan duration)
    {
        var kind = AlertKinds.Parse(kindCode);
        lock (_gate)
        {
            if (kind is null || Find(chamber) is not { } alarms || duration <= TimeSpan.Zero)
            {
                return false;
            }
            double nowS = Seconds(UnixMicros.From(timeProvider.GetUtcNow()));
            alarms.Monitor.Shelve(kind.Value, nowS + duration.TotalSeconds, nowS);
            Drain(alarms);
            return true;
        }
    }

    /// <summary>The daemon-wide store condition as an acknowledgeable alarm of its own.</summary>
    public void AcknowledgeStoreAlert() => _signals.Writer.TryWrite(new AlertSignal(AlertKinds.StoreUnwritable, null, null, AlertKinds.StoreUnwritable,
        _storeDown ? AlarmState.ActiveAcknowledged : AlarmState.Normal, timeProvider.GetUtcNow(), double.NaN, "acknowledged"));

    internal static double Seconds(long unixMicros) => (unixMicros - EpochUs) / 1e6;

    internal static DateTimeOffset Instant(double seconds) => UnixMicros.ToDateTimeOffset(EpochUs + (long)Math.Round(seconds * 1e6));

    private ChamberAlarms? Get(long chamberId)
    {
        if (_chambers.TryGetValue(chamberId, out var alarms))
        {
            return alarms;
        }
        if (!registry.IsReady || registry.Registry.Find(chamberId) is not { } chamber)
        {
            return null;
        }
        alarms = new ChamberAlarms(chamber);
        _chambers[chamberId] = alarms;
        return alarms;
    }

    private ChamberAlarms? Find(string chamber)
    {
        var runtime = registry.Registry.All.FirstOrDefault(c => c.Name == chamber);
        return runtime is null ? null : Get(runtime.ChamberId);
    }

    private void DrainAll()
    {
        foreach (var alarms in _chambers.Values)
        {
            Drain(alarms);
        }
    }

    private void Drain(ChamberAlarms alarms, bool replayed = false)
    {
        if (alarms.Pending.Count == 0)
        {
            return;
        }
        var chamber = alarms.Chamber;
        foreach (var t in alarms.Pending)
        {
            string code = AlertKinds.Code(t.Kind);
            string message = AlertKinds.Describe(t.Kind) + (double.IsFinite(t.ValueC)
                ? string.Create(CultureInfo.InvariantCulture, $" ({t.ValueC:F1} °C, setpoint {alarms.SetpointC:F1} °C)")
                : "");
            _signals.Writer.TryWrite(new AlertSignal(chamber.Name + "/" + code, chamber.Name, chamber.Site, code, t.To, Instant(t.TimeS), t.ValueC, message, replayed));
        }
        alarms.Pending.Clear();
    }
}
