using System.Globalization;
using RunWatch.Core.Qc;
using RunWatch.Storage;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// Wafer, field, report and process-model reads over the store's wafer tables and the report files the pipeline
/// wrote (their JSON summary and wire CSV), for <see cref="StoreDashboardData"/>.
/// </summary>
public sealed partial class StoreWaferData(IWaferStore wafers)
{
    public async Task<WaferDetail?> GetWaferAsync(string waferId, CancellationToken cancellationToken)
    {
        WaferRecord? wafer = await wafers.GetWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        if (wafer is null)
        {
            return null;
        }
        RunRecord? run = await wafers.FindRunOfWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        var fields = new List<FieldView>();
        IReadOnlyList<FieldRecord> fieldRecords = await wafers.GetFieldsOfWaferAsync(waferId, cancellationToken).ConfigureAwait(false);
        var analyses = new List<AnalysisRecord>();
        var names = new Dictionary<long, string>();
        foreach (FieldRecord f in fieldRecords)
        {
            AnalysisRecord? a = await wafers.GetLatestAnalysisAsync(f.Id, cancellationToken).ConfigureAwait(false);
            if (a is not null)
            {
                analyses.Add(a);
                names[a.FieldId] = f.RelativePath;
            }
            fields.Add(new FieldView(f.Id.ToString(CultureInfo.InvariantCulture), f.RelativePath, f.ImportedAt, f.NmPerPx ?? double.NaN, a?.WireCount ?? 0));
        }
        var reports = await wafers.GetReportsAsync(waferId, cancellationToken).ConfigureAwait(false);
        WaferReportRecord? json = reports.FirstOrDefault(r => r.Format == "json");
        WaferReportRecord? csv = reports.FirstOrDefault(r => r.Format == "csv");
        WaferStatistics? statistics = null;
        VerdictView? verdict = null;
        WaferDiffusionView? diffusion = null;
        if (json?.SummaryJson is { } summary)
        {
            (statistics, verdict) = ReadSummary(summary, json.CreatedAt);
            diffusion = DiffusionOf(WaferReportDigestJson.Read(summary));
        }
        IReadOnlyList<WireMeasurement> wires = csv is not null && File.Exists(csv.FilePath) ? await ReadWiresAsync(csv.FilePath, cancellationToken).ConfigureAwait(false) : [];
        if (statistics is not null)
        {
            statistics = statistics with
            {
                ClarkEvansR = MeanClarkEvans(analyses),
                MeanNormalisedCaptureArea = MeanNormalisedArea(wires),
            };
        }
        return new WaferDetail(waferId, run?.Name ?? "", fields, statistics, wires, verdict, [.. reports.Select(r => r.Format).OrderBy(f => f, StringComparer.Ordinal)],
            diffusion, Droplets(names, analyses));
    }

    /// <summary>
    /// Wire and droplet radius from each field's stored result (read through Storage's <see cref="FieldResultJson"/>);
    /// null when no wire of the wafer carries a droplet. A result that cannot be read is left out, not fatal.
    /// </summary>
    private static WaferDroplets? Droplets(Dictionary<long, string> names, List<AnalysisRecord> analyses)
    {
        var perField = new List<FieldDroplets>();
        var pooled = new List<RunWatch.Core.Wafers.FieldWire>();
        foreach (AnalysisRecord a in analyses)
        {
            if (a.ResultsJson is not { Length: > 0 } json)
            {
                continue;
            }
            RunWatch.Core.Wafers.FieldResult result;
            try
            {
                result = FieldResultJson.Read(json);
            }
            catch (Exception ex) when (ex is System.Text.Json.JsonException or InvalidDataException)
            {
                continue;
            }
            pooled.AddRange(result.Wires);
            var figures = RunWatch.Core.Wafers.DropletFigures.From(result.Wires);
            if (figures.WithDroplet > 0)
            {
                perField.Add(new FieldDroplets(names.GetValueOrDefault(a.FieldId, result.FieldName), figures));
            }
        }
        return perField.Count > 0 ? new WaferDroplets(RunWatch.Core.Wafers.DropletFigures.From(pooled), perField) : null;
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
                path = WaferFiles.OverlayPath(WaferFiles.WaferFolderOfReport(any.FilePath), id);
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

    private static VerdictOutcome Outcome(QcOutcome outcome) => outcome switch { QcOutcome.Pass => VerdictOutcome.Pass, QcOutcome.Fail => VerdictOutcome.Fail, _ => VerdictOutcome.Review };

    private static (WaferStatistics?, VerdictView?) ReadSummary(string json, DateTimeOffset at)
    {
        WaferReportDigest digest = WaferReportDigestJson.Read(json);
        WaferStatistics? statistics = digest.Statistics is { } s
            ? new WaferStatistics(s.Count, s.DensityPerCm2 / 1e8, s.MeanRadiusNm, s.RadiusSdNm, double.NaN, double.NaN)
            : null;
        VerdictView? verdict = null;
        if (digest.Verdict is { } v)
        {
            var reasons = new List<string>();
            var all = new List<VerdictRuleView>();
            foreach (QcRuleResult rule in v.Rules)
            {
                if (rule.Outcome != QcOutcome.Pass)
                {
                    reasons.Add($"{rule.Outcome.ToString().ToLowerInvariant()}: {rule.Reason}");
                }
                // Every rule, passed ones included, with what was measured and the limits it was held to.
                all.Add(new VerdictRuleView(rule.Rule, rule.Measured, rule.Limit, rule.WarnLimit, rule.Unit, Outcome(rule.Outcome), rule.Reason));
            }
            PredictionAgreement? agreement = digest.Agreement is { } a
                ? new PredictionAgreement(a.Count, a.BiasNm, a.RmseNm, a.RSquared, a.MeanAbsoluteErrorNm)
                : null;
            verdict = new VerdictView(Outcome(v.Outcome), reasons, at, all, agreement);
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
}
