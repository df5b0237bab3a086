using System.Globalization;
using System.Text.Json;
using Microsoft.Extensions.Options;
using RunWatch.Storage;
using StoredAlertState = RunWatch.Storage.AlertState;
using StoredAudit = RunWatch.Storage.AuditEntry;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// The dashboard's read model and actions over the daemon's store (<see cref="IRunWatchStore"/>) and alert
/// commands (<see cref="IAlertCommands"/>): chambers, telemetry, runs, alerts and the audit log; wafers, fields,
/// reports and process models through <see cref="StoreWaferData"/>; QC specifications through the store's
/// <see cref="QcSpecificationCatalog"/>; refits through the host's <see cref="IModelRefitter"/>. A part the host
/// did not register reports nothing stored, and its actions answer with a plain "not available".
/// </summary>
public sealed class StoreDashboardData(IRunWatchStore store, IAlertCommands alerts, TimeProvider time, IOptions<DashboardOptions> options,
    StoreWaferData? wafers = null, IFieldAssigner? assigner = null, QcSpecificationCatalog? specifications = null, IModelRefitter? refitter = null,
    IChamberBandSource? bands = null)
    : IDashboardQueries, IDashboardCommands
{
    private const int MaxSamples = 2_000_000;
    private const string CommentSubject = "alert ";
    private const string CommentSuffix = " (comment)";

    public async Task<IReadOnlyList<ChamberStatus>> GetChambersAsync(CancellationToken cancellationToken)
    {
        var chambers = await store.ListChambersAsync(cancellationToken).ConfigureAwait(false);
        var result = new List<ChamberStatus>(chambers.Count);
        foreach (var c in chambers)
        {
            result.Add(await ComposeAsync(c, cancellationToken).ConfigureAwait(false));
        }
        return result;
    }

    public async Task<ChamberStatus?> GetChamberAsync(string chamber, CancellationToken cancellationToken)
    {
        var chambers = await store.ListChambersAsync(cancellationToken).ConfigureAwait(false);
        var c = chambers.FirstOrDefault(x => x.Definition.Name == chamber);
        return c is null ? null : await ComposeAsync(c, cancellationToken).ConfigureAwait(false);
    }

    public async Task<SampleSeries> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken)
    {
        IReadOnlyList<SampleRecord> rows;
        try
        {
            // The store's range is half-open at microsecond resolution; the dashboard's is closed.
            rows = await store.GetSamplesAsync(chamber, channel, from, to.AddTicks(10), MaxSamples, cancellationToken).ConfigureAwait(false);
        }
        catch (KeyNotFoundException)
        {
            return new SampleSeries([], []);
        }
        var t = new double[rows.Count];
        var v = new double[rows.Count];
        for (int i = 0; i < rows.Count; i++)
        {
            t[i] = rows[i].Timestamp.ToUnixTimeMilliseconds() / 1000.0;
            v[i] = rows[i].Value;
        }
        return new SampleSeries(t, v);
    }

    public async Task<IReadOnlyList<RunSummary>> GetRunsAsync(CancellationToken cancellationToken)
    {
        var runs = await store.ListRunsAsync(null, null, 1000, cancellationToken).ConfigureAwait(false);
        var verdicts = wafers is null ? null : await wafers.GetRunVerdictsAsync(cancellationToken).ConfigureAwait(false);
        return runs.Select(r => ToSummary(r) with { Verdict = verdicts is not null && verdicts.TryGetValue(r.Id, out string? v) ? v : null }).ToList();
    }

    public async Task<RunDetail?> GetRunAsync(string runId, CancellationToken cancellationToken)
    {
        var runs = await store.ListRunsAsync(null, null, 1000, cancellationToken).ConfigureAwait(false);
        var run = runs.FirstOrDefault(r => r.Name == runId);
        if (run is null)
        {
            return null;
        }
        var chambers = await store.ListChambersAsync(cancellationToken).ConfigureAwait(false);
        string channel = chambers.FirstOrDefault(c => c.Definition.Name == run.Chamber)?.Definition.Channels
            .FirstOrDefault(ch => ch.Role == ChannelRole.GrowthTemperature)?.Name ?? "substrate_tc";
        ThermalResult? thermal = null;
        double c = RunThermalSummary.ConventionFactorOf(run);
        if (run.LEffNm is { } leff && run.TEffC is { } teff)
        {
            thermal = new ThermalResult(run.LNomNm ?? double.NaN, leff, teff, c, (run.Coverage ?? 0) * 100, double.NaN, double.NaN);
        }
        var summary = ToSummary(run);
        RadiusPrediction? prediction = null;
        if (wafers is not null)
        {
            var verdicts = await wafers.GetRunVerdictsAsync(cancellationToken).ConfigureAwait(false);
            summary = summary with { Verdict = verdicts.TryGetValue(run.Id, out string? v) ? v : null };
            prediction = await wafers.GetRunPredictionAsync(run.Id, cancellationToken).ConfigureAwait(false);
        }
        return new RunDetail(summary, thermal, Excursions(run.Excursions, run.LEffNm), prediction, channel) { Diffusion = run.Summary?.Diffusion };
    }

    public Task<WaferDetail?> GetWaferAsync(string waferId, CancellationToken cancellationToken) =>
        wafers?.GetWaferAsync(waferId, cancellationToken) ?? Task.FromResult<WaferDetail?>(null);

    public Task<ReportFile?> GetFieldImageAsync(string fieldId, bool overlay, CancellationToken cancellationToken) =>
        wafers?.GetFieldImageAsync(fieldId, overlay, cancellationToken) ?? Task.FromResult<ReportFile?>(null);

    public Task<IReadOnlyList<UnmatchedField>> GetUnmatchedFieldsAsync(CancellationToken cancellationToken) =>
        wafers?.GetUnmatchedFieldsAsync(cancellationToken) ?? Task.FromResult<IReadOnlyList<UnmatchedField>>([]);

    public Task<ReportFile?> GetReportAsync(string waferId, string format, CancellationToken cancellationToken) =>
        wafers?.GetReportAsync(waferId, format, cancellationToken) ?? Task.FromResult<ReportFile?>(null);

    public async Task<IReadOnlyList<AlertView>> GetAlertsAsync(CancellationToken cancellationToken)
    {
        var now = time.GetUtcNow();
        var active = await store.GetActiveAlertsAsync(cancellationToken).ConfigureAwait(false);
        var history = await store.GetAlertHistoryAsync(now.AddDays(-30), now.AddSeconds(1), 500, cancellationToken).ConfigureAwait(false);
        var runs = (await store.ListRunsAsync(null, null, 1000, cancellationToken).ConfigureAwait(false)).ToDictionary(r => r.Id, r => r.Name);
        var comments = await AlertCommentsAsync(cancellationToken).ConfigureAwait(false);
        return active.Concat(history).DistinctBy(a => a.Id).OrderByDescending(a => a.RaisedAt)
            .Select(a =>
            {
                string id = a.Id.ToString(CultureInfo.InvariantCulture);
                return new AlertView(id, a.Chamber ?? "daemon",
                    a.RunId is { } r && runs.TryGetValue(r, out var name) ? name : null, a.Message,
                    a.Severity == Storage.AlertSeverity.High ? AlertSeverity.Alarm : AlertSeverity.Warning, Map(a.State), a.RaisedAt, a.ClearedAt,
                    a.AcknowledgedBy, comments.TryGetValue(CommentSubject + id, out string? comment) ? comment : null, null, null,
                    a.DetailJson is { } detail && detail.Contains("\"suppressedByDesign\":true", StringComparison.Ordinal));
            })
            .ToList();
    }

    public Task<IReadOnlyList<string>> GetProcessesAsync(CancellationToken cancellationToken) =>
        wafers?.GetProcessesAsync(cancellationToken) ?? Task.FromResult<IReadOnlyList<string>>([]);

    public Task<ProcessModelView?> GetProcessModelAsync(string process, CancellationToken cancellationToken) =>
        wafers?.GetProcessModelAsync(process, cancellationToken) ?? Task.FromResult<ProcessModelView?>(null);

    public async Task<IReadOnlyList<SpecEntry>> GetSpecsAsync(CancellationToken cancellationToken)
    {
        if (specifications is null)
        {
            return [];
        }
        var rows = new List<SpecEntry>();
        foreach (StoredQcSpecification stored in await specifications.ListAsync(cancellationToken).ConfigureAwait(false))
        {
            rows.AddRange(QcSpecRows.From(stored.Recipe, stored.Specification));
        }
        return rows;
    }

    public async Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxEntries, CancellationToken cancellationToken)
    {
        var entries = await store.GetAuditAsync(maxEntries, cancellationToken).ConfigureAwait(false);
        return entries.Select(e => new AuditEntry(e.At, e.Actor, e.Action, e.Subject ?? "", AuditDetail.Text(e.DetailJson))).ToList();
    }

    public async Task AcknowledgeAlertAsync(string alertId, string user, string comment, CancellationToken cancellationToken)
    {
        long id = ParseId(alertId);
        // One audit entry per acknowledgement: the alert commands write it with the comment in it.
        if (!await alerts.AcknowledgeAsync(id, user, string.IsNullOrWhiteSpace(comment) ? null : comment, cancellationToken).ConfigureAwait(false))
        {
            throw new InvalidOperationException($"Alert {alertId} is unknown or has nothing to acknowledge.");
        }
    }

    public async Task ShelveAlertAsync(string alertId, string user, string comment, DateTimeOffset until, CancellationToken cancellationToken)
    {
        long id = ParseId(alertId);
        var duration = until - time.GetUtcNow();
        if (duration <= TimeSpan.Zero
            || !await alerts.ShelveAsync(id, duration, user, string.IsNullOrWhiteSpace(comment) ? null : comment, cancellationToken).ConfigureAwait(false))
        {
            throw new InvalidOperationException($"Alert {alertId} is unknown, already normal, or the shelf would not expire in the future.");
        }
    }

    public async Task AssignFieldAsync(string fieldId, string waferId, string user, CancellationToken cancellationToken)
    {
        if (assigner is null)
        {
            throw new InvalidOperationException("Field assignment is not available in this host (no wafer pipeline).");
        }
        await assigner.AssignAsync(ParseId(fieldId), waferId, user, cancellationToken).ConfigureAwait(false);
    }

    public async Task RefitModelAsync(string process, string user, CancellationToken cancellationToken)
    {
        if (refitter is null)
        {
            throw new InvalidOperationException("Refitting is not available in this host (no wafer pipeline).");
        }
        ArgumentException.ThrowIfNullOrWhiteSpace(process);
        string proposed = await refitter.RefitAsync(process, cancellationToken).ConfigureAwait(false);
        await store.AppendAuditAsync(new StoredAudit(time.GetUtcNow(), user, "model refitted", process, AuditDetail.Json(proposed)), cancellationToken).ConfigureAwait(false);
    }

    public async Task AcceptModelAsync(string process, string user, CancellationToken cancellationToken)
    {
        if (wafers is null)
        {
            throw new InvalidOperationException("Accepting a model is not available: this host has no wafer store.");
        }
        string accepted = await wafers.AcceptModelAsync(process, user, cancellationToken).ConfigureAwait(false);
        await store.AppendAuditAsync(new StoredAudit(time.GetUtcNow(), user, "model accepted", process, AuditDetail.Json(accepted)), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Validates the edited row against its rule and the whole specification, then stores it with an audit entry (old → new).</summary>
    /// <exception cref="ArgumentException">The edit is invalid; nothing is changed.</exception>
    /// <exception cref="KeyNotFoundException">No such recipe or rule.</exception>
    public async Task UpdateSpecAsync(SpecEntry spec, string user, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(spec);
        if (specifications is null)
        {
            throw new InvalidOperationException("Specs are not available in this host (no specification store).");
        }
        var all = await specifications.ListAsync(cancellationToken).ConfigureAwait(false);
        StoredQcSpecification stored = all.FirstOrDefault(s => s.Recipe == spec.Recipe)
            ?? throw new KeyNotFoundException(spec.Recipe.Length == 0 ? "No default specification is stored." : $"No specification for recipe '{spec.Recipe}'.");
        SpecEntry before = QcSpecRows.From(stored.Recipe, stored.Specification).FirstOrDefault(r => r.Name == spec.Name)
            ?? throw new KeyNotFoundException($"No spec '{spec.Name}'.");
        var updated = QcSpecRows.Apply(stored.Specification, spec);
        SpecEntry after = QcSpecRows.From(stored.Recipe, updated).First(r => r.Name == spec.Name);
        await specifications.UpdateAsync(stored.Recipe, updated, user, QcSpecRows.Describe(before, after), stored.UpdatedAt, cancellationToken).ConfigureAwait(false);
    }

    public Task RecordAuditAsync(AuditEntry entry, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(entry);
        return store.AppendAuditAsync(new StoredAudit(entry.At, entry.User, entry.Action, entry.Subject,
            JsonSerializer.Serialize(new Dictionary<string, string> { ["detail"] = entry.Detail })), cancellationToken);
    }

    /// <summary>The newest operator comment per alert, from the audit trail where acknowledging and shelving write it.</summary>
    private async Task<Dictionary<string, string>> AlertCommentsAsync(CancellationToken cancellationToken)
    {
        var comments = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var entry in await store.GetAuditAsync(5000, cancellationToken).ConfigureAwait(false))
        {
            // Newest first: the first comment seen for an alert is its latest. The alert commands write it with the
            // action ("alert-acknowledged", subject the alert id); older stores have a separate "(comment)" entry.
            string? subject = entry.Subject is null ? null
                : entry.Action is "alert-acknowledged" or "alert-shelved" ? CommentSubject + entry.Subject
                : entry.Subject.StartsWith(CommentSubject, StringComparison.Ordinal) && entry.Action.EndsWith(CommentSuffix, StringComparison.Ordinal) ? entry.Subject
                : null;
            if (subject is not null && !comments.ContainsKey(subject) && entry.DetailJson is { } json)
            {
                using var doc = JsonDocument.Parse(json);
                if (doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty("detail", out var detail) && detail.GetString() is { } text)
                {
                    comments[subject] = text;
                }
            }
        }
        return comments;
    }

    private async Task<ChamberStatus> ComposeAsync(RegisteredChamber chamber, CancellationToken cancellationToken)
    {
        var now = time.GetUtcNow();
        var latest = new Dictionary<string, double>(StringComparer.Ordinal);
        var latestTimes = new Dictionary<string, DateTimeOffset>(StringComparer.Ordinal);
        DateTimeOffset? lastAt = null;
        foreach (var channel in chamber.Channels)
        {
            // Latest value within the live window; older values are not "latest" for reminders and the overview.
            var rows = await store.GetSamplesAsync(chamber.Definition.Name, channel.Definition.Name, now - options.Value.LiveWindow, now.AddSeconds(1),
                MaxSamples, cancellationToken).ConfigureAwait(false);
            if (rows.Count == 0)
            {
                continue;
            }
            latest[channel.Definition.Name] = rows[^1].Value;
            latestTimes[channel.Definition.Name] = rows[^1].Timestamp;
            if (lastAt is null || rows[^1].Timestamp > lastAt)
            {
                lastAt = rows[^1].Timestamp;
            }
        }
        var defs = chamber.Definition.Channels;
        string temperature = defs.FirstOrDefault(c => c.Role == ChannelRole.GrowthTemperature)?.Name ?? "substrate_tc";
        string setpoint = defs.FirstOrDefault(c => c.Role == ChannelRole.Setpoint)?.Name ?? "substrate_sp";
        var runs = await store.ListRunsAsync(chamber.Definition.Name, null, 20, cancellationToken).ConfigureAwait(false);
        var open = runs.FirstOrDefault(r => r.Status == RunStatus.Open);
        var lastEnded = runs.Where(r => r.EndedAt is not null).Max(r => r.EndedAt);
        var active = await store.GetActiveAlertsAsync(cancellationToken).ConfigureAwait(false);
        return new ChamberStatus(chamber.Definition.Name, chamber.Definition.Site,
            latest.TryGetValue(temperature, out double t) ? t : null,
            latest.TryGetValue(setpoint, out double sp) ? sp : open?.SetpointC,
            temperature, setpoint, "°C", lastAt, open is null ? null : ToSummary(open), lastEnded,
            // Open means raised and not over: shelved alerts and conditions suppressed by design are not open.
            active.Count(a => a.Chamber == chamber.Definition.Name
                && a.State is StoredAlertState.Unacknowledged or StoredAlertState.Acknowledged or StoredAlertState.ReturnedUnacknowledged), latest,
            bands?.BandsFor(chamber.Definition.Name) ?? new TemperatureBands(options.Value.WarningBandK, options.Value.AlarmBandK),
            latestTimes, ReminderRoles(defs), [.. defs.Select(d => d.Name)]);
    }

    /// <summary>The configured channel of each channel role that a reminder reads (same names in both enums).</summary>
    private static Dictionary<Core.Safety.ReminderChannelRole, string> ReminderRoles(IEnumerable<ChannelDefinition> channels)
    {
        var roles = new Dictionary<Core.Safety.ReminderChannelRole, string>();
        foreach (var channel in channels)
        {
            if (channel.Role != ChannelRole.Other && Enum.TryParse(channel.Role.ToString(), out Core.Safety.ReminderChannelRole role))
            {
                roles.TryAdd(role, channel.Name);
            }
        }
        return roles;
    }

    private static RunSummary ToSummary(RunRecord r)
    {
        GrowthWindow? window = r.Summary is { } summary
            ? new GrowthWindow(r.StartedAt.AddSeconds(summary.WindowStartS), r.StartedAt.AddSeconds(summary.WindowEndS))
            : null;
        return new RunSummary(r.Name, r.Chamber, r.Recipe ?? "—", r.StartedAt, r.EndedAt, r.SetpointC ?? double.NaN,
            // The runs table counts the excursions that matter: inside the growth window and not on a ramp (suppressed by design).
            TimeSpan.FromSeconds(r.PlannedSeconds ?? 0), window, r.Wafers, r.Excursions?.Count(e => e.InGrowthWindow && !e.SuppressedByDesign) ?? 0, null, r.LEffNm);
    }

    private static List<ExcursionView> Excursions(IReadOnlyList<RunExcursionRecord>? excursions, double? lEffNm)
    {
        var list = new List<ExcursionView>();
        foreach (RunExcursionRecord e in excursions ?? [])
        {
            double changeNm = e.LengthChangeNm ?? double.NaN;
            list.Add(new ExcursionView(e.Start, e.End, e.PeakDeviationK,
                e.Severity == RunWatch.Core.Excursions.ExcursionSeverity.Alarm ? AlertSeverity.Alarm : AlertSeverity.Warning,
                lEffNm is { } l && l > 0 ? changeNm / l * 100 : double.NaN,
                e.InGrowthWindow, e.SuppressedByDesign));
        }
        return list;
    }

    private static Data.AlertState Map(StoredAlertState state) => state switch
    {
        StoredAlertState.Unacknowledged => Data.AlertState.ActiveUnacknowledged,
        StoredAlertState.Acknowledged => Data.AlertState.ActiveAcknowledged,
        StoredAlertState.ReturnedUnacknowledged => Data.AlertState.ReturnedUnacknowledged,
        StoredAlertState.Shelved => Data.AlertState.Shelved,
        StoredAlertState.Suppressed => Data.AlertState.Suppressed,
        _ => Data.AlertState.Normal,
    };

    private static long ParseId(string alertId) =>
        long.TryParse(alertId, NumberStyles.None, CultureInfo.InvariantCulture, out long id) ? id : throw new KeyNotFoundException($"No alert '{alertId}'.");
}
