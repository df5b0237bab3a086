using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Storage;
using CoreArrheniusFit = RunWatch.Core.Model.ArrheniusFit;
using CoreArrheniusPoint = RunWatch.Core.Model.ArrheniusPoint;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// Wafer, field, report and process-model reads over the store's wafer tables and the report files the pipeline
/// wrote (their JSON summary and wire CSV), for <see cref="StoreDashboardData"/>.
/// </summary>
public sealed class StoreWaferData(IWaferStore wafers)
{
    private const string RadiusModel = "radius";
    private const string CaptureRadiusModel = "capture-radius";
    private const string ArrheniusModel = "arrhenius";
    private const int MaxRadiusPoints = 5000;

    public async Task<WaferDetail?> GetWaferAsync(string waferId, CancellationToken cancellationToken)
    {
        WaferRecord? wafer = await wafers.GetWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        if (wafer is null)
        {
            return null;
        }
        RunRecord? run = await wafers.FindRunOfWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        var fields = new List<FieldView>();
        foreach (FieldRecord f in await wafers.GetFieldsOfWaferAsync(waferId, cancellationToken).ConfigureAwait(false))
        {
            AnalysisRecord? a = await wafers.GetLatestAnalysisAsync(f.Id, cancellationToken).ConfigureAwait(false);
            fields.Add(new FieldView(f.Id.ToString(CultureInfo.InvariantCulture), f.RelativePath, f.ImportedAt, f.NmPerPx ?? double.NaN, a?.WireCount ?? 0));
        }
        var reports = await wafers.GetReportsAsync(waferId, cancellationToken).ConfigureAwait(false);
        WaferReportRecord? json = reports.FirstOrDefault(r => r.Format == "json");
        WaferReportRecord? csv = reports.FirstOrDefault(r => r.Format == "csv");
        WaferStatistics? statistics = null;
        VerdictView? verdict = null;
        if (json?.SummaryJson is { } summary)
        {
            (statistics, verdict) = ReadSummary(summary, json.CreatedAt);
        }
        IReadOnlyList<WireMeasurement> wires = csv is not null && File.Exists(csv.FilePath) ? await ReadWiresAsync(csv.FilePath, cancellationToken).ConfigureAwait(false) : [];
        return new WaferDetail(waferId, run?.Name ?? "", fields, statistics, wires, verdict, [.. reports.Select(r => r.Format).OrderBy(f => f, StringComparer.Ordinal)]);
    }

    public async Task<ReportFile?> GetReportAsync(string waferId, string format, CancellationToken cancellationToken)
    {
        var reports = await wafers.GetReportsAsync(waferId, cancellationToken).ConfigureAwait(false);
        WaferReportRecord? report = reports.FirstOrDefault(r => r.Format == format);
        if (report is null || !File.Exists(report.FilePath))
        {
            return null;
        }
        string type = format switch
        {
            "pdf" => "application/pdf",
            "html" => "text/html; charset=utf-8",
            "csv" => "text/csv; charset=utf-8",
            "json" => "application/json",
            _ => "application/octet-stream",
        };
        return new ReportFile(Path.GetFileName(report.FilePath), type, await File.ReadAllBytesAsync(report.FilePath, cancellationToken).ConfigureAwait(false));
    }

    /// <summary>The field's overlay (beside the wafer's reports) or its original image when that is a PNG or JPEG.</summary>
    public async Task<ReportFile?> GetFieldImageAsync(string fieldId, bool overlay, CancellationToken cancellationToken)
    {
        if (!long.TryParse(fieldId, NumberStyles.None, CultureInfo.InvariantCulture, out long id))
        {
            return null;
        }
        FieldRecord? field = await wafers.GetFieldAsync(id, cancellationToken).ConfigureAwait(false);
        if (field?.Wafer is null)
        {
            return null;
        }
        string? path = null;
        if (overlay)
        {
            var reports = await wafers.GetReportsAsync(field.Wafer, cancellationToken).ConfigureAwait(false);
            if (reports.FirstOrDefault() is { } any)
            {
                path = WaferFiles.OverlayPath(Path.GetDirectoryName(any.FilePath)!, id);
            }
        }
        else if (Path.GetExtension(field.FilePath).ToLowerInvariant() is ".png" or ".jpg" or ".jpeg")
        {
            path = field.FilePath;
        }
        if (path is null || !File.Exists(path))
        {
            return null;
        }
        string type = path.EndsWith(".png", StringComparison.OrdinalIgnoreCase) ? "image/png" : "image/jpeg";
        return new ReportFile(Path.GetFileName(path), type, await File.ReadAllBytesAsync(path, cancellationToken).ConfigureAwait(false));
    }

    public async Task<IReadOnlyList<UnmatchedField>> GetUnmatchedFieldsAsync(CancellationToken cancellationToken)
    {
        var list = new List<UnmatchedField>();
        foreach (FieldRecord f in await wafers.GetFieldsByStatusAsync(FieldStatus.Unassigned, 500, cancellationToken).ConfigureAwait(false))
        {
            list.Add(new UnmatchedField(f.Id.ToString(CultureInfo.InvariantCulture), f.RelativePath, f.ImportedAt, f.Problem ?? "no wafer"));
        }
        return list;
    }

    public async Task<IReadOnlyList<string>> GetProcessesAsync(CancellationToken cancellationToken)
    {
        var processes = new SortedSet<string>(StringComparer.Ordinal);
        foreach (WaferRecord w in await wafers.ListWafersAsync(1000, cancellationToken).ConfigureAwait(false))
        {
            if (w.Process is { Length: > 0 } p)
            {
                processes.Add(p);
            }
        }
        return [.. processes];
    }

    public async Task<ProcessModelView?> GetProcessModelAsync(string process, CancellationToken cancellationToken)
    {
        var radius = await wafers.GetModelFitsAsync(process, RadiusModel, 50, cancellationToken).ConfigureAwait(false);
        var arrheniusFits = await wafers.GetModelFitsAsync(process, ArrheniusModel, 50, cancellationToken).ConfigureAwait(false);
        if (radius.Count == 0 && arrheniusFits.Count == 0)
        {
            return null;
        }
        var (accepted, candidate) = AcceptedAndProposed(radius);
        var (acceptedArrhenius, candidateArrhenius) = AcceptedAndProposed(arrheniusFits);
        ModelFitRecord? shown = accepted ?? candidate;
        RadiusFit current = shown is null ? new RadiusFit(RadiusModelForm.Linear, double.NaN, double.NaN, double.NaN, double.NaN, 0, DateTimeOffset.MinValue) : ToRadiusFit(shown);
        ArrheniusFit arrhenius = (acceptedArrhenius ?? candidateArrhenius) is { } a ? ToArrhenius(a) : new ArrheniusFit(double.NaN, double.NaN, double.NaN);
        var points = new List<ArrheniusPoint>();
        foreach (ModelFitRecord r in await wafers.GetModelFitsAsync(process, CaptureRadiusModel, 500, cancellationToken).ConfigureAwait(false))
        {
            using var doc = JsonDocument.Parse(r.ParamsJson);
            JsonElement e = doc.RootElement;
            double l = Get(e, "captureRadiusNm") * 1e-7;
            double t = Get(e, "growthDurationS");
            double c = Get(e, "conventionFactor");
            double tK = Get(e, "effectiveTemperatureK");
            if (l > 0 && t > 0 && c > 0)
            {
                points.Add(new ArrheniusPoint(tK, l * l / (c * t)));
            }
        }
        IReadOnlyList<ModelPoint> wires = await RadiusDataAsync(process, cancellationToken).ConfigureAwait(false);
        // With nothing accepted yet the newest proposal is shown as the model and offered for acceptance.
        return new ProcessModelView(process, current, candidate is null ? null : ToRadiusFit(candidate), arrhenius, wires, points,
            accepted?.AcceptedBy, accepted?.AcceptedAt, acceptedArrhenius is not null && candidateArrhenius is not null ? ToArrhenius(candidateArrhenius) : null);
    }

    /// <summary>
    /// Accepts, in the name of <paramref name="user"/>, the newest proposed radius model and the newest proposed
    /// Arrhenius calibration of the process (each when newer than the one accepted); returns what was accepted.
    /// </summary>
    /// <exception cref="InvalidOperationException">Nothing is proposed.</exception>
    public async Task<string> AcceptModelAsync(string process, string user, CancellationToken cancellationToken)
    {
        var accepted = new List<string>();
        foreach (string model in new[] { RadiusModel, ArrheniusModel })
        {
            var fits = await wafers.GetModelFitsAsync(process, model, 50, cancellationToken).ConfigureAwait(false);
            if (AcceptedAndProposed(fits).Proposed is { } proposed)
            {
                await wafers.AcceptModelFitAsync(proposed.Id, user, cancellationToken).ConfigureAwait(false);
                accepted.Add(model == RadiusModel ? "radius model " + Describe(ToRadiusFit(proposed)) : "Arrhenius fit " + Describe(ToArrhenius(proposed)));
            }
        }
        if (accepted.Count == 0)
        {
            throw new InvalidOperationException($"Process {process} has no proposed model to accept; refit first.");
        }
        return "accepted " + string.Join("; ", accepted);
    }

    /// <summary>
    /// The model the planner uses for <paramref name="process"/>: its accepted radius model and accepted Arrhenius
    /// calibration, each replaced by the configured default (<paramref name="defaults"/>) when none is accepted.
    /// The convention factor c is the one of the capture radii the accepted calibration was fitted on.
    /// </summary>
    public async Task<PlannerModel> GetPlannerModelAsync(string process, PlannerOptions defaults, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        ModelFitRecord? radius = process.Length == 0 ? null
            : AcceptedAndProposed(await wafers.GetModelFitsAsync(process, RadiusModel, 50, cancellationToken).ConfigureAwait(false)).Accepted;
        ModelFitRecord? arrhenius = process.Length == 0 ? null
            : AcceptedAndProposed(await wafers.GetModelFitsAsync(process, ArrheniusModel, 50, cancellationToken).ConfigureAwait(false)).Accepted;
        RadiusModelForm form = RadiusModelForm.Linear;
        double a = defaults.RadiusInterceptNm;
        double b = defaults.RadiusSlopeNm;
        if (radius is not null)
        {
            RadiusModelFit fit = ModelJson.Deserialize<RadiusModelFit>(radius.ParamsJson);
            (form, a, b) = (fit.Kind == RadiusModelKind.PowerLaw ? RadiusModelForm.PowerLaw : RadiusModelForm.Linear, fit.Parameters[0].Value, fit.Parameters[1].Value);
        }
        double d0 = defaults.D0CmSquaredPerSecond;
        double ea = defaults.ActivationEnergyEv;
        double c = defaults.ConventionFactor;
        if (arrhenius is not null)
        {
            CoreArrheniusFit fit = ModelJson.Deserialize<CoreArrheniusFit>(arrhenius.ParamsJson);
            (d0, ea) = (fit.Prefactor.Value, fit.ActivationEnergy.Value);
            c = await ConventionFactorAsync(process, fit.WaferIds, cancellationToken).ConfigureAwait(false) ?? c;
        }
        return new PlannerModel(process, form, a, b, radius?.AcceptedBy, radius?.AcceptedAt, d0, ea, c, arrhenius?.AcceptedBy, arrhenius?.AcceptedAt);
    }

    /// <summary>The configured defaults only, for a process without accepted models or a host without wafer tables.</summary>
    public static PlannerModel DefaultPlannerModel(string process, PlannerOptions defaults)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        return new PlannerModel(process, RadiusModelForm.Linear, defaults.RadiusInterceptNm, defaults.RadiusSlopeNm, null, null,
            defaults.D0CmSquaredPerSecond, defaults.ActivationEnergyEv, defaults.ConventionFactor, null, null);
    }

    private async Task<double?> ConventionFactorAsync(string process, IReadOnlyList<string> waferIds, CancellationToken cancellationToken)
    {
        var wanted = new HashSet<string>(waferIds, StringComparer.Ordinal);
        var counts = new Dictionary<double, int>();
        foreach (ModelFitRecord r in await wafers.GetModelFitsAsync(process, CaptureRadiusModel, 1000, cancellationToken).ConfigureAwait(false))
        {
            CoreArrheniusPoint point = ModelJson.Deserialize<CoreArrheniusPoint>(r.ParamsJson);
            if (wanted.Remove(point.WaferId) && point.ConventionFactor > 0)
            {
                counts[point.ConventionFactor] = counts.GetValueOrDefault(point.ConventionFactor) + 1;
            }
        }
        // The daemon uses one convention per deployment; should points disagree, the most common one is used.
        return counts.Count == 0 ? null : counts.MaxBy(kv => kv.Value).Key;
    }

    /// <summary>
    /// The wires a refit pools (vertical, clear of edge and band, with a normalised capture area), from the latest
    /// analysis of each analysed field of the process's wafers, at most <see cref="MaxRadiusPoints"/> for the chart.
    /// </summary>
    private async Task<IReadOnlyList<ModelPoint>> RadiusDataAsync(string process, CancellationToken cancellationToken)
    {
        var points = new List<ModelPoint>();
        foreach (WaferRecord wafer in await wafers.ListWafersAsync(1000, cancellationToken).ConfigureAwait(false))
        {
            if (wafer.Process != process)
            {
                continue;
            }
            foreach (FieldRecord field in await wafers.GetFieldsOfWaferAsync(wafer.Name, cancellationToken).ConfigureAwait(false))
            {
                AnalysisRecord? analysis = field.Status == FieldStatus.Analysed
                    ? await wafers.GetLatestAnalysisAsync(field.Id, cancellationToken).ConfigureAwait(false)
                    : null;
                if (analysis?.ResultsJson is not { } json)
                {
                    continue;
                }
                using var doc = JsonDocument.Parse(json);
                if (!doc.RootElement.TryGetProperty("wires", out JsonElement list) || list.ValueKind != JsonValueKind.Array)
                {
                    continue;
                }
                foreach (JsonElement w in list.EnumerateArray())
                {
                    double a = Get(w, "zoneNormalised");
                    double r = Get(w, "radiusNm");
                    if (points.Count < MaxRadiusPoints && Flag(w, "vertical") && Flag(w, "interior") && a > 0 && double.IsFinite(r))
                    {
                        points.Add(new ModelPoint(a, r, wafer.Name));
                    }
                }
            }
        }
        return points;
    }

    private static bool Flag(JsonElement e, string name) => e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.True;

    /// <summary>The newest accepted fit and the newest proposal made after it (fits are newest first).</summary>
    private static (ModelFitRecord? Accepted, ModelFitRecord? Proposed) AcceptedAndProposed(IReadOnlyList<ModelFitRecord> fits)
    {
        ModelFitRecord? accepted = fits.FirstOrDefault(f => f.AcceptedAt is not null);
        ModelFitRecord? proposed = fits.FirstOrDefault(f => f.AcceptedAt is null && (accepted is null || f.Id > accepted.Id));
        return (accepted, proposed);
    }

    private static string Describe(RadiusFit f) => f.Form == RadiusModelForm.Linear
        ? string.Create(CultureInfo.InvariantCulture, $"r = {f.A:0.###} + {f.B:0.###}·Â nm")
        : string.Create(CultureInfo.InvariantCulture, $"r = {f.A:0.###}·Â^{f.B:0.####} nm");

    private static string Describe(ArrheniusFit f) =>
        string.Create(CultureInfo.InvariantCulture, $"Ea {f.ActivationEnergyEv:0.###} eV, D0 {f.D0CmSquaredPerSecond:0.###e+0} cm²/s");

    private static RadiusFit ToRadiusFit(ModelFitRecord r)
    {
        using var doc = JsonDocument.Parse(r.ParamsJson);
        JsonElement e = doc.RootElement;
        var form = e.TryGetProperty("kind", out JsonElement k) && k.GetString() == "PowerLaw" ? RadiusModelForm.PowerLaw : RadiusModelForm.Linear;
        double a = double.NaN;
        double b = double.NaN;
        if (e.TryGetProperty("parameters", out JsonElement ps) && ps.ValueKind == JsonValueKind.Array && ps.GetArrayLength() >= 2)
        {
            a = Get(ps[0], "value");
            b = Get(ps[1], "value");
        }
        return new RadiusFit(form, a, b, r.RSquared ?? double.NaN, r.RmseNm ?? double.NaN, (int)Get(e, "count"), r.FittedAt);
    }

    private static ArrheniusFit ToArrhenius(ModelFitRecord r)
    {
        using var doc = JsonDocument.Parse(r.ParamsJson);
        JsonElement e = doc.RootElement;
        double ea = e.TryGetProperty("activationEnergy", out JsonElement ae) ? Get(ae, "value") : double.NaN;
        double d0 = e.TryGetProperty("prefactor", out JsonElement pf) ? Get(pf, "value") : double.NaN;
        return new ArrheniusFit(d0, ea, r.RSquared ?? double.NaN);
    }

    private static (WaferStatistics?, VerdictView?) ReadSummary(string json, DateTimeOffset at)
    {
        using var doc = JsonDocument.Parse(json);
        JsonElement root = doc.RootElement;
        WaferStatistics? statistics = null;
        if (root.TryGetProperty("statistics", out JsonElement s) && s.ValueKind == JsonValueKind.Object)
        {
            statistics = new WaferStatistics((int)Get(s, "count"), Get(s, "densityPerCm2") / 1e8, Get(s, "meanRadiusNm"), Get(s, "radiusSdNm"), double.NaN, double.NaN);
        }
        VerdictView? verdict = null;
        if (root.TryGetProperty("verdict", out JsonElement v) && v.ValueKind == JsonValueKind.Object)
        {
            var outcome = v.TryGetProperty("outcome", out JsonElement o) ? o.GetString() : null;
            var reasons = new List<string>();
            if (v.TryGetProperty("rules", out JsonElement rules) && rules.ValueKind == JsonValueKind.Array)
            {
                foreach (JsonElement rule in rules.EnumerateArray())
                {
                    if (rule.TryGetProperty("outcome", out JsonElement ro) && ro.GetString() != "Pass" && rule.TryGetProperty("reason", out JsonElement reason))
                    {
                        reasons.Add($"{ro.GetString()!.ToLowerInvariant()}: {reason.GetString()}");
                    }
                }
            }
            verdict = new VerdictView(outcome switch { "Pass" => VerdictOutcome.Pass, "Fail" => VerdictOutcome.Fail, _ => VerdictOutcome.Review }, reasons, at);
        }
        return (statistics, verdict);
    }

    private static async Task<IReadOnlyList<WireMeasurement>> ReadWiresAsync(string path, CancellationToken cancellationToken)
    {
        var wires = new List<WireMeasurement>();
        string[] lines = await File.ReadAllLinesAsync(path, cancellationToken).ConfigureAwait(false);
        for (int i = 1; i < lines.Length; i++)
        {
            // Columns: wafer_id, field, wire, x_nm, y_nm, radius_nm, normalised_area, predicted_radius_nm, vertical.
            // Numbers are the last six cells, so a quoted field name with commas does not shift them.
            string[] cells = lines[i].Split(',');
            if (cells.Length < 9)
            {
                continue;
            }
            int n = cells.Length;
            wires.Add(new WireMeasurement(Number(cells[n - 4]), Number(cells[n - 3]), Number(cells[n - 2])));
        }
        return wires;
    }

    private static double Number(string cell) =>
        double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) ? v : double.NaN;

    private static double Get(JsonElement e, string name) =>
        e.ValueKind == JsonValueKind.Object && e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : double.NaN;
}
