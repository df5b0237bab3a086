using System.Globalization;
using RunWatch.Core.Model;
using RunWatch.Web.Data;

namespace RunWatch.Testing.Dashboard;

public sealed partial class InMemoryDashboardData
{
    public Task AcknowledgeAlertAsync(string alertId, string user, string comment, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            int i = FindAlert(alertId);
            var alert = _alerts[i];
            // ISA-18.2: acknowledging an active alarm keeps it active; a returned one goes back to normal.
            var next = alert.State switch
            {
                AlertState.ActiveUnacknowledged => AlertState.ActiveAcknowledged,
                AlertState.ReturnedUnacknowledged => AlertState.Normal,
                _ => throw new InvalidOperationException($"Alert {alertId} is {alert.State}; only unacknowledged alerts can be acknowledged."),
            };
            _alerts[i] = alert with { State = next, AcknowledgedBy = user, Comment = comment };
            Audit(user, "alert acknowledged", alertId, comment);
        }
        return Task.CompletedTask;
    }

    public Task ShelveAlertAsync(string alertId, string user, string comment, DateTimeOffset until, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            int i = FindAlert(alertId);
            var alert = _alerts[i];
            if (alert.State == AlertState.Normal)
            {
                throw new InvalidOperationException($"Alert {alertId} has returned to normal; there is nothing to shelve.");
            }
            if (until <= time.GetUtcNow())
            {
                throw new InvalidOperationException("A shelf must expire in the future.");
            }
            _alerts[i] = alert with { State = AlertState.Shelved, ShelvedUntil = until, ShelvedBy = user, Comment = comment };
            Audit(user, "alert shelved", alertId, comment + " (until " + until.ToString("u", CultureInfo.InvariantCulture) + ")");
        }
        return Task.CompletedTask;
    }

    public Task AssignFieldAsync(string fieldId, string waferId, string user, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            int i = _unmatched.FindIndex(f => f.FieldId == fieldId);
            if (i < 0)
            {
                throw new KeyNotFoundException($"No unmatched field '{fieldId}'.");
            }
            if (!_wafers.TryGetValue(waferId, out var wafer))
            {
                throw new KeyNotFoundException($"No wafer '{waferId}'.");
            }
            var field = _unmatched[i];
            _unmatched.RemoveAt(i);
            _wafers[waferId] = wafer with { Fields = [.. wafer.Fields, new FieldView(field.FieldId, field.FileName, field.AcquiredAt, 0, 0)] };
            Audit(user, "field assigned", fieldId, "to wafer " + waferId);
        }
        return Task.CompletedTask;
    }

    public Task RefitModelAsync(string process, string user, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            var model = _models.GetValueOrDefault(process) ?? throw new KeyNotFoundException($"No process '{process}'.");
            var fit = Refit(model.Current.Form, model.RadiusData, time.GetUtcNow());
            _models[process] = model with { Candidate = fit };
            Audit(user, "model refit", process, string.Create(CultureInfo.InvariantCulture, $"{fit.Form}: A={fit.A:G4}, B={fit.B:G4}, r²={fit.RSquared:F3}, n={fit.Points}"));
        }
        return Task.CompletedTask;
    }

    public Task AcceptModelAsync(string process, string user, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            var model = _models.GetValueOrDefault(process) ?? throw new KeyNotFoundException($"No process '{process}'.");
            var candidate = model.Candidate ?? throw new InvalidOperationException("There is no refit to accept; refit first.");
            _models[process] = model with { Current = candidate, Candidate = null, AcceptedBy = user, AcceptedAt = time.GetUtcNow() };
            Audit(user, "model accepted", process, string.Create(CultureInfo.InvariantCulture, $"{candidate.Form}: A={candidate.A:G4}, B={candidate.B:G4}"));
        }
        return Task.CompletedTask;
    }

    public Task UpdateSpecAsync(SpecEntry spec, string user, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(spec);
        if (spec.Min is { } min && spec.Max is { } max && min > max)
        {
            throw new ArgumentException($"Spec {spec.Name}: minimum {min} is above maximum {max}.", nameof(spec));
        }
        lock (_gate)
        {
            int i = _specs.FindIndex(s => s.Name == spec.Name);
            if (i < 0)
            {
                throw new KeyNotFoundException($"No spec '{spec.Name}'.");
            }
            var old = _specs[i];
            _specs[i] = spec;
            Audit(user, "spec edited", spec.Name, string.Create(CultureInfo.InvariantCulture, $"{old.Min}…{old.Max} → {spec.Min}…{spec.Max} {spec.Unit}"));
        }
        return Task.CompletedTask;
    }

    public Task RecordAuditAsync(AuditEntry entry, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(entry);
        lock (_gate)
        {
            _audit.Add(entry);
        }
        return Task.CompletedTask;
    }

    /// <summary>The refit by Core's radius model fitter (least squares), as the store-backed source refits.</summary>
    private static RadiusFit Refit(RadiusModelForm form, IReadOnlyList<ModelPoint> data, DateTimeOffset at)
    {
        if (data.Count < 3)
        {
            throw new InvalidOperationException($"A refit needs at least 3 wires; the process has {data.Count}.");
        }
        double[] areas = [.. data.Select(p => p.NormalisedCaptureArea)];
        double[] radii = [.. data.Select(p => p.RadiusNm)];
        RadiusModelFit fit = RadiusModelFitter.Fit(form == RadiusModelForm.PowerLaw ? RadiusModelKind.PowerLaw : RadiusModelKind.Linear, areas, radii);
        return new RadiusFit(form, fit.Parameters[0].Value, fit.Parameters[1].Value, fit.RSquared, fit.RmseNm, fit.Count, at);
    }
}
