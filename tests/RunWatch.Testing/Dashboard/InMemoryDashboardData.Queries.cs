using RunWatch.Web.Data;

namespace RunWatch.Testing.Dashboard;

public sealed partial class InMemoryDashboardData
{
    public Task<IReadOnlyList<ChamberStatus>> GetChambersAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<ChamberStatus> list = _chambers.Keys.Order(StringComparer.Ordinal).Select(Compose).ToList();
            return Task.FromResult(list);
        }
    }

    public Task<ChamberStatus?> GetChamberAsync(string chamber, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            return Task.FromResult(_chambers.ContainsKey(chamber) ? Compose(chamber) : null);
        }
    }

    public Task<SampleSeries> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            var series = _samples.TryGetValue((chamber, channel), out var buffer)
                ? buffer.Range(from.ToUnixTimeMilliseconds() / 1000.0, to.ToUnixTimeMilliseconds() / 1000.0)
                : new SampleSeries([], []);
            return Task.FromResult(series);
        }
    }

    public Task<IReadOnlyList<RunSummary>> GetRunsAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<RunSummary> list = _runs.Select(r => r.Summary).OrderByDescending(r => r.Start).ToList();
            return Task.FromResult(list);
        }
    }

    public Task<RunDetail?> GetRunAsync(string runId, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            return Task.FromResult(_runs.Find(r => r.Summary.RunId == runId));
        }
    }

    public Task<WaferDetail?> GetWaferAsync(string waferId, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            return Task.FromResult(_wafers.GetValueOrDefault(waferId));
        }
    }

    public Task<ReportFile?> GetFieldImageAsync(string fieldId, bool overlay, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            return Task.FromResult(_fieldImages.GetValueOrDefault((fieldId, overlay)));
        }
    }

    public Task<IReadOnlyList<UnmatchedField>> GetUnmatchedFieldsAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<UnmatchedField> list = _unmatched.ToList();
            return Task.FromResult(list);
        }
    }

    public Task<ReportFile?> GetReportAsync(string waferId, string format, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            return Task.FromResult(_reports.GetValueOrDefault((waferId, format)));
        }
    }

    public Task<IReadOnlyList<AlertView>> GetAlertsAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            var now = time.GetUtcNow();
            // A shelf that has expired returns the alert to its unshelved state (ISA-18.2: shelving is temporary).
            for (int i = 0; i < _alerts.Count; i++)
            {
                var a = _alerts[i];
                if (a.State == AlertState.Shelved && a.ShelvedUntil <= now)
                {
                    _alerts[i] = a with { State = a.ClearedAt is null ? AlertState.ActiveUnacknowledged : AlertState.Normal, ShelvedUntil = null };
                }
            }
            IReadOnlyList<AlertView> list = _alerts.OrderByDescending(a => a.RaisedAt).ToList();
            return Task.FromResult(list);
        }
    }

    public Task<IReadOnlyList<string>> GetProcessesAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<string> list = _models.Keys.Order(StringComparer.Ordinal).ToList();
            return Task.FromResult(list);
        }
    }

    public Task<ProcessModelView?> GetProcessModelAsync(string process, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            return Task.FromResult(_models.GetValueOrDefault(process));
        }
    }

    public Task<IReadOnlyList<SpecEntry>> GetSpecsAsync(CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<SpecEntry> list = _specs.ToList();
            return Task.FromResult(list);
        }
    }

    public Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxEntries, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            IReadOnlyList<AuditEntry> list = Enumerable.Reverse(_audit).Take(maxEntries).ToList();
            return Task.FromResult(list);
        }
    }

    private ChamberStatus Compose(string name)
    {
        var c = _chambers[name];
        var latest = new Dictionary<string, double>(StringComparer.Ordinal);
        var latestTimes = new Dictionary<string, DateTimeOffset>(StringComparer.Ordinal);
        DateTimeOffset? lastAt = null;
        foreach (var ((chamber, channel), buffer) in _samples)
        {
            if (chamber != name || buffer.Latest is not { } point)
            {
                continue;
            }
            latest[channel] = point.Value;
            var at = DateTimeOffset.FromUnixTimeMilliseconds((long)Math.Round(point.Time * 1000));
            latestTimes[channel] = at;
            if (lastAt is null || at > lastAt)
            {
                lastAt = at;
            }
        }
        var active = _runs.Where(r => r.Summary.Chamber == name && r.Summary.End is null).Select(r => r.Summary).FirstOrDefault();
        var lastEnded = _runs.Where(r => r.Summary.Chamber == name && r.Summary.End is not null).Max(r => r.Summary.End);
        int open = _alerts.Count(a => a.Chamber == name && a.State is AlertState.ActiveUnacknowledged or AlertState.ActiveAcknowledged or AlertState.ReturnedUnacknowledged);
        return c with
        {
            Temperature = latest.TryGetValue(c.TemperatureChannel, out double t) ? t : null,
            Setpoint = latest.TryGetValue(c.SetpointChannel, out double sp) ? sp : active?.SetpointC,
            LastSampleAt = lastAt,
            ActiveRun = active,
            LastRunEndedAt = lastEnded,
            OpenAlerts = open,
            LatestValues = latest,
            LatestTimes = latestTimes,
        };
    }
}
