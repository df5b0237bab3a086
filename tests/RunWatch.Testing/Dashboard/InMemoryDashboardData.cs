using RunWatch.Web.Data;

namespace RunWatch.Testing.Dashboard;

/// <summary>
/// A complete in-memory data source for the dashboard: used by the tests, the browser tests and the benchmark,
/// and usable by the demo. Thread-safe: one lock guards all state, and queries return copies.
/// </summary>
public sealed partial class InMemoryDashboardData(TimeProvider time) : IDashboardQueries, IDashboardCommands
{
    private readonly Lock _gate = new();
    private readonly Dictionary<string, ChamberStatus> _chambers = new(StringComparer.Ordinal);
    private readonly Dictionary<(string Chamber, string Channel), SampleBuffer> _samples = new();
    private readonly List<RunDetail> _runs = [];
    private readonly Dictionary<string, WaferDetail> _wafers = new(StringComparer.Ordinal);
    private readonly Dictionary<(string Wafer, string Format), ReportFile> _reports = new();
    private readonly Dictionary<(string Field, bool Overlay), ReportFile> _fieldImages = new();
    private readonly List<UnmatchedField> _unmatched = [];
    private readonly List<AlertView> _alerts = [];
    private readonly Dictionary<string, ProcessModelView> _models = new(StringComparer.Ordinal);
    private readonly List<SpecEntry> _specs = [];
    private readonly List<AuditEntry> _audit = [];

    /// <summary>Adds a chamber; latest values, temperature and alert count are derived from stored data.</summary>
    public void AddChamber(ChamberStatus chamber)
    {
        ArgumentNullException.ThrowIfNull(chamber);
        lock (_gate)
        {
            _chambers[chamber.Chamber] = chamber;
        }
    }

    /// <summary>Appends samples of one channel; times must be ascending and later than those already stored.</summary>
    public void AppendSamples(string chamber, string channel, ReadOnlySpan<double> unixSeconds, ReadOnlySpan<double> values)
    {
        if (unixSeconds.Length != values.Length)
        {
            throw new ArgumentException("Times and values differ in length.", nameof(values));
        }
        lock (_gate)
        {
            if (!_samples.TryGetValue((chamber, channel), out var buffer))
            {
                buffer = new SampleBuffer();
                _samples[(chamber, channel)] = buffer;
            }
            buffer.Append(unixSeconds, values);
        }
    }

    /// <summary>Appends one sample (convenience for tests and the scenario).</summary>
    public void AddSamples(string chamber, string channel, DateTimeOffset at, double value) =>
        AppendSamples(chamber, channel, [at.ToUnixTimeMilliseconds() / 1000.0], [value]);

    public void AddRun(RunDetail run)
    {
        ArgumentNullException.ThrowIfNull(run);
        lock (_gate)
        {
            _runs.RemoveAll(r => r.Summary.RunId == run.Summary.RunId);
            _runs.Add(run);
        }
    }

    /// <summary>Marks a chamber's active run as ended at the given time.</summary>
    public void EndRun(string runId, DateTimeOffset end)
    {
        lock (_gate)
        {
            int i = _runs.FindIndex(r => r.Summary.RunId == runId);
            if (i < 0)
            {
                throw new KeyNotFoundException($"No run '{runId}'.");
            }
            _runs[i] = _runs[i] with { Summary = _runs[i].Summary with { End = end } };
        }
    }

    public void AddWafer(WaferDetail wafer)
    {
        ArgumentNullException.ThrowIfNull(wafer);
        lock (_gate)
        {
            _wafers[wafer.WaferId] = wafer;
        }
    }

    public void AddReport(string waferId, string format, ReportFile report)
    {
        lock (_gate)
        {
            _reports[(waferId, format)] = report;
        }
    }

    public void AddFieldImage(string fieldId, bool overlay, ReportFile image)
    {
        lock (_gate)
        {
            _fieldImages[(fieldId, overlay)] = image;
        }
    }

    public void AddUnmatchedField(UnmatchedField field)
    {
        lock (_gate)
        {
            _unmatched.Add(field);
        }
    }

    public void AddAlert(AlertView alert)
    {
        ArgumentNullException.ThrowIfNull(alert);
        lock (_gate)
        {
            _alerts.RemoveAll(a => a.AlertId == alert.AlertId);
            _alerts.Add(alert);
        }
    }

    /// <summary>The condition behind an alert went away: active ones return to normal (if acknowledged) or become returned-unacknowledged.</summary>
    public void ClearAlert(string alertId)
    {
        lock (_gate)
        {
            int i = FindAlert(alertId);
            var alert = _alerts[i];
            var next = alert.State switch
            {
                AlertState.ActiveUnacknowledged => AlertState.ReturnedUnacknowledged,
                AlertState.ActiveAcknowledged => AlertState.Normal,
                _ => alert.State,
            };
            _alerts[i] = alert with { State = next, ClearedAt = time.GetUtcNow() };
        }
    }

    public void AddProcessModel(ProcessModelView model)
    {
        ArgumentNullException.ThrowIfNull(model);
        lock (_gate)
        {
            _models[model.Process] = model;
        }
    }

    public void AddSpec(SpecEntry spec)
    {
        lock (_gate)
        {
            _specs.RemoveAll(s => s.Name == spec.Name);
            _specs.Add(spec);
        }
    }

    private int FindAlert(string alertId)
    {
        int i = _alerts.FindIndex(a => a.AlertId == alertId);
        return i >= 0 ? i : throw new KeyNotFoundException($"No alert '{alertId}'.");
    }

    private void Audit(string user, string action, string subject, string detail) =>
        _audit.Add(new AuditEntry(time.GetUtcNow(), user, action, subject, detail));
}
