using RunWatch.Core.Excursions;
using RunWatch.Storage;

namespace RunWatch.Ingest.Alerts;

/// <summary>
/// The lifecycle bookkeeping: applies a signal to the current alert of its key (ISA-18.2 states) and says which change
/// it was. Pure and single-threaded (the dispatcher owns it), so it is tested without a store or a broker.
/// </summary>
internal sealed class AlertBook
{
    /// <summary>Change name of a condition recorded as suppressed by design (not sent to sinks).</summary>
    public const string SuppressedChange = "suppressed";

    /// <summary>Change name of a suppressed condition that cleared without being raised (not sent to sinks).</summary>
    public const string SuppressionEndedChange = "suppression-ended";

    /// <summary>Detail kept with a record that was suppressed by design, so that history can tell it from a raised alert.</summary>
    public const string SuppressedDetail = """{"suppressedByDesign":true}""";

    private readonly Dictionary<string, AlertRecord> _current = new(StringComparer.Ordinal);
    private readonly Dictionary<string, DateTimeOffset> _replayHorizon = new(StringComparer.Ordinal);

    /// <summary>Alerts not back to normal, by key.</summary>
    public IReadOnlyDictionary<string, AlertRecord> Current => _current;

    public void Load(IEnumerable<AlertRecord> active)
    {
        foreach (var alert in active)
        {
            _current[alert.Key] = alert;
        }
    }

    /// <summary>
    /// Replaces every alert of <paramref name="chamber"/> with <paramref name="active"/> (a takeover in fleet mode) and
    /// remembers, per key, the last change the store holds (<paramref name="recent"/>, any state, normal included), so
    /// that replayed signals up to it are not applied twice.
    /// </summary>
    public void Replace(string chamber, IEnumerable<AlertRecord> active, IEnumerable<AlertRecord> recent)
    {
        foreach (var alert in recent)
        {
            if (!_replayHorizon.TryGetValue(alert.Key, out var known) || alert.UpdatedAt > known)
            {
                _replayHorizon[alert.Key] = alert.UpdatedAt;
            }
        }
        foreach (var key in _current.Where(kv => kv.Value.Chamber == chamber).Select(kv => kv.Key).ToList())
        {
            _current.Remove(key);
        }
        Load(active);
    }

    /// <summary>Replaces the stored copy (after a save gave it an id).</summary>
    public void Update(AlertRecord alert)
    {
        if (alert.State == AlertState.Normal)
        {
            _current.Remove(alert.Key);
        }
        else
        {
            _current[alert.Key] = alert;
        }
    }

    /// <summary>The record after the signal and the name of the change, or null when the signal changes nothing.</summary>
    public (AlertRecord Alert, string Change)? Apply(AlertSignal signal, string? user = null)
    {
        _current.TryGetValue(signal.Key, out var existing);
        // A replayed signal (takeover) that the store already holds: the previous owner recorded this change, or a
        // later one, already (its last change of the key is at or after the signal).
        if (signal.Replayed && _replayHorizon.TryGetValue(signal.Key, out var known) && signal.At <= known)
        {
            return null;
        }
        double? value = double.IsFinite(signal.Value) ? signal.Value : null;
        (AlertRecord, string)? result = signal.To switch
        {
            AlarmState.SuppressedByDesign when existing is null || existing.State == AlertState.Normal => (new AlertRecord
            {
                Key = signal.Key, Chamber = signal.Chamber, Kind = signal.Kind, Severity = AlertKinds.Severity(signal.Kind),
                State = AlertState.Suppressed, Message = signal.Message, RaisedAt = signal.At, UpdatedAt = signal.At, PeakValue = value,
                DetailJson = SuppressedDetail,
            }, SuppressedChange),
            AlarmState.ActiveUnacknowledged when existing is null || existing.State == AlertState.Normal => (new AlertRecord
            {
                Key = signal.Key, Chamber = signal.Chamber, Kind = signal.Kind, Severity = AlertKinds.Severity(signal.Kind),
                State = AlertState.Unacknowledged, Message = signal.Message, RaisedAt = signal.At, UpdatedAt = signal.At, PeakValue = value,
            }, existing?.State == AlertState.Shelved ? "unshelved" : "raised"),
            AlarmState.ActiveUnacknowledged => (existing with
            {
                // Raised out of suppression (the ramp timed out, or growth began off setpoint): raised from now.
                State = AlertState.Unacknowledged, ClearedAt = null, Message = signal.Message, UpdatedAt = signal.At, PeakValue = value ?? existing.PeakValue,
                RaisedAt = existing.State == AlertState.Suppressed ? signal.At : existing.RaisedAt,
                DetailJson = existing.State == AlertState.Suppressed ? null : existing.DetailJson,
            }, existing.State == AlertState.Shelved ? "unshelved" : "raised"),
            AlarmState.Normal when existing is { State: AlertState.Suppressed } => (existing with
            {
                State = AlertState.Normal, ClearedAt = signal.At, UpdatedAt = signal.At,
            }, SuppressionEndedChange),
            AlarmState.ActiveAcknowledged when existing is not null => (existing with
            {
                State = AlertState.Acknowledged, AcknowledgedAt = signal.At, AcknowledgedBy = user ?? existing.AcknowledgedBy, UpdatedAt = signal.At,
            }, "acknowledged"),
            AlarmState.ReturnedToNormalUnacknowledged when existing is not null => (existing with
            {
                State = AlertState.ReturnedUnacknowledged, ClearedAt = signal.At, UpdatedAt = signal.At,
            }, "cleared"),
            AlarmState.Normal when existing is not null => (existing with
            {
                State = AlertState.Normal,
                ClearedAt = existing.ClearedAt ?? signal.At,
                AcknowledgedAt = existing.State is AlertState.ReturnedUnacknowledged or AlertState.Unacknowledged ? signal.At : existing.AcknowledgedAt,
                AcknowledgedBy = existing.State is AlertState.ReturnedUnacknowledged or AlertState.Unacknowledged ? user ?? existing.AcknowledgedBy : existing.AcknowledgedBy,
                UpdatedAt = signal.At,
            }, existing.State == AlertState.Acknowledged ? "cleared" : "normal"),
            AlarmState.Shelved when existing is not null => (existing with { State = AlertState.Shelved, UpdatedAt = signal.At }, "shelved"),
            AlarmState.Shelved => (new AlertRecord
            {
                Key = signal.Key, Chamber = signal.Chamber, Kind = signal.Kind, Severity = AlertKinds.Severity(signal.Kind),
                State = AlertState.Shelved, Message = signal.Message, RaisedAt = signal.At, UpdatedAt = signal.At, PeakValue = value,
            }, "shelved"),
            _ => null,
        };
        if (result is { } r)
        {
            Update(r.Item1);
        }
        return result;
    }
}
