using System.Globalization;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Excursions;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Qc;
using RunWatch.Core.Thermal;
using RunWatch.Core.Wafers;
using RunWatch.Reports;
using RunWatch.Reports.Model;
using RunWatch.Storage;
using RunWatch.Wafers.Records;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Gathers a wafer's run, fields and analyses from the store, evaluates it and writes its report files (HTML, PDF,
/// CSV of every wire, JSON summary) as the wafer's next numbered revision (<c>reports/{wafer}/r{N}/</c>, never
/// overwritten), recording the revision with its reason, requester and hashes, and each file, in the store.
/// </summary>
public sealed class WaferReportService
{
    private readonly IRunWatchStore _store;
    private readonly IWaferStore _wafers;
    private readonly WaferPipelineOptions _options;
    private readonly QcOptions _qc;
    private readonly QcSpecificationCatalog? _specifications;
    private readonly string _reportsRoot;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly IReportRevisionStore _revisions;

    public WaferReportService(IRunWatchStore store, IWaferStore wafers, IOptions<WaferPipelineOptions> options, IOptions<QcOptions> qc,
        IOptions<StorageOptions> storage, TimeProvider time, ILogger<WaferReportService>? logger = null, QcSpecificationCatalog? specifications = null,
        IReportRevisionStore? revisions = null)
    {
        _store = store;
        _wafers = wafers;
        // Both stores keep revisions; a store that does not cannot issue records, so it is refused here, not later.
        _revisions = revisions ?? wafers as IReportRevisionStore
            ?? throw new ArgumentException("the wafer store keeps no report revisions (IReportRevisionStore)", nameof(wafers));
        _options = options.Value;
        _qc = qc.Value;
        _specifications = specifications;
        _reportsRoot = Path.GetFullPath(Path.Combine(storage.Value.DataDirectory, _options.ReportsFolder));
        _time = time;
        _logger = (ILogger?)logger ?? NullLogger.Instance;
    }

    /// <summary>Folder where overlays and reports of <paramref name="wafer"/> go.</summary>
    public string FolderFor(string wafer) => Path.Combine(_reportsRoot, SafeFolderName(wafer));

    /// <summary>
    /// Evaluates the wafer and writes its next report revision, answering the wafer's pending requests (re-analysis,
    /// new field); without one the reason is "first issue" (asked by "intake") or "written again".
    /// </summary>
    /// <exception cref="KeyNotFoundException">The wafer is unknown or has no analysed field.</exception>
    public Task<WaferReportOutcome> WriteAsync(string wafer, CancellationToken cancellationToken) => WriteAsync(wafer, null, cancellationToken);

    /// <summary>
    /// As <see cref="WriteAsync(string, CancellationToken)"/>; <paramref name="onDemand"/> (requester and reason, for
    /// example from <c>runwatch report</c>) is recorded with the pending requests.
    /// </summary>
    public async Task<WaferReportOutcome> WriteAsync(string wafer, ReportRequestRecord? onDemand, CancellationToken cancellationToken)
    {
        var inputs = new List<ReportInputHash>();
        WaferRecord record = await _wafers.GetWaferAsync(wafer, cancellationToken).ConfigureAwait(false)
            ?? throw new KeyNotFoundException($"wafer {wafer} is not known");
        RunRecord? run = await _wafers.FindRunOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false);
        var fields = new List<FieldResult>();
        var thumbnails = new List<FieldThumbnail>();
        string folder = FolderFor(wafer);
        foreach (FieldRecord field in await _wafers.GetFieldsOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false))
        {
            if (field.Status != FieldStatus.Analysed)
            {
                continue;
            }
            AnalysisRecord? analysis = await _wafers.GetLatestAnalysisAsync(field.Id, cancellationToken).ConfigureAwait(false);
            if (analysis?.ResultsJson is null)
            {
                continue;
            }
            FieldResult result = FieldResultJson.Read(analysis.ResultsJson);
            fields.Add(result);
            inputs.Add(new ReportInputHash(field.Id, field.RelativePath ?? Path.GetFileName(field.FilePath), field.FilePath, field.Sha256));
            string overlay = WaferFiles.OverlayPath(folder, field.Id);
            if (File.Exists(overlay))
            {
                thumbnails.Add(new FieldThumbnail(result.FieldName, await File.ReadAllBytesAsync(overlay, cancellationToken).ConfigureAwait(false),
                    Caption(result), result.Wires.Count, DropletFigures.From(result.Wires)));
            }
        }
        if (fields.Count == 0)
        {
            throw new KeyNotFoundException($"wafer {wafer} has no analysed field yet");
        }

        string recipe = run?.Recipe ?? record.Process ?? _options.DefaultProcess;
        string process = record.Process ?? recipe;
        (RadiusModelFit? accepted, string modelId) = await AcceptedModelAsync(process, cancellationToken).ConfigureAwait(false);
        (ModelFitRecord Record, DiffusionModelParams Params)? diffusion = null;
        ThermalExposure? exposure = null;
        string? exposureMissing = null;
        if (_options.RadiusModel != WaferRadiusModel.CaptureAreaRegression)
        {
            diffusion = await RunGrowthHistory.AcceptedModelAsync(_wafers, process, cancellationToken).ConfigureAwait(false);
            if (diffusion is not null)
            {
                (exposure, exposureMissing) = await new RunGrowthHistory(_store).LoadAsync(run, cancellationToken).ConfigureAwait(false);
            }
        }
        RunExcursions excursions = RunExcursions.From(run);
        // The stored specification (seeded from configuration, edited by admins) when the store keeps them.
        QcSpecification specification;
        bool unspecified = false;
        try
        {
            specification = _specifications is null
                ? _qc.SpecificationFor(recipe)
                : await _specifications.SpecificationForAsync(recipe, cancellationToken).ConfigureAwait(false);
        }
        catch (KeyNotFoundException)
        {
            // A recipe nobody specified (and no default): still a report, judged against no limits and said so.
            specification = new QcSpecification();
            unspecified = true;
        }
        // The diffusion options solve the field several times: off the caller's thread.
        var evaluation = await Task.Run(() => WaferEvaluator.Evaluate(new WaferEvaluationInput
        {
            WaferId = wafer,
            Recipe = recipe,
            Process = process,
            Fields = fields,
            RadiusModel = _options.RadiusModel,
            DiffusionModel = diffusion?.Params.Model,
            GrowthExposure = exposure,
            GrowthExposureMissing = exposureMissing,
            CaptureTable = new CaptureTableOptions { CellSizeUm = _options.CaptureCellNm / 1000 },
            AcceptedModel = accepted,
            Thermal = new RunThermalFacts(run?.LEffNm, run?.Coverage, excursions.Count, excursions.MaxAbsRelativeLChange),
            Specification = specification,
            PredictionSeed = _options.PredictionSeed,
            PredictionFields = _options.PredictionFields,
            CaptureRadiusSearchMin = _options.CaptureRadiusSearchMin,
            CaptureRadiusSearchMax = _options.CaptureRadiusSearchMax,
        }), cancellationToken).ConfigureAwait(false);
        DiffusionModelFigures? diffusionFigures = evaluation.Diffusion is { } applied && diffusion is { } used
            ? new DiffusionModelFigures(used.Record.Id, used.Params.Model, applied, run?.Summary?.Diffusion?.MeanRadiusNm, run?.Summary?.Diffusion?.RadiusSdNm)
            : null;
        if (evaluation.ModelFittedOnThisWafer && evaluation.Model is not null)
        {
            // Proposed, never accepted automatically: a person accepts process models.
            await _wafers.SaveModelFitAsync(new ModelFitRecord
            {
                Process = process,
                Model = ModelKinds.Radius,
                FittedAt = _time.GetUtcNow(),
                ParamsJson = ModelJson.Serialize(evaluation.Model),
                RSquared = evaluation.Model.RSquared,
                RmseNm = evaluation.Model.RmseNm,
                Wafers = [wafer],
            }, cancellationToken).ConfigureAwait(false);
        }

        if (evaluation.BestCaptureRadius is { } best && run?.TEffC is { } tEffC)
        {
            // One point of the process's Arrhenius calibration: this wafer's best-fit capture radius at its T_eff.
            GrowthWindow window = RunThermalSummary.GrowthWindowOf(run);
            var point = new ArrheniusPoint(wafer, best.CaptureRadiusNm, window.DurationS, PhysicalConstants.CelsiusToKelvin(tEffC), RunThermalSummary.ConventionFactorOf(run));
            await _wafers.SaveModelFitAsync(new ModelFitRecord
            {
                Process = process,
                Model = ModelKinds.CaptureRadius,
                FittedAt = _time.GetUtcNow(),
                ParamsJson = ModelJson.Serialize(point),
                RSquared = best.Fit.RSquared,
                RmseNm = best.Fit.RmseNm,
                Wafers = [wafer],
            }, cancellationToken).ConfigureAwait(false);
        }

        QcVerdict verdictInForce = unspecified ? Unspecified(evaluation.Verdict, recipe) : evaluation.Verdict;
        ThermalSummary thermal = await ThermalAsync(run, excursions, cancellationToken).ConfigureAwait(false);
        var notes = new List<string> { "Generated by RunWatch" };
        if (_options.DataNote.Length > 0)
        {
            notes.Add(_options.DataNote);
        }
        if (unspecified)
        {
            notes.Add(UnspecifiedText(recipe));
        }
        notes.AddRange(evaluation.Notes);
        foreach (FieldResult f in fields)
        {
            foreach (string n in f.Notes)
            {
                notes.Add(f.FieldName + ": " + n);
            }
        }
        var report = new WaferReport(
            new ReportIdentity(wafer, run?.Name ?? "unknown run", recipe, run?.Chamber ?? "unknown chamber", run?.StartedAt ?? record.CreatedAt,
                run?.EndedAt, _time.GetUtcNow(), typeof(WaferReportService).Assembly.GetName().Version?.ToString() ?? "dev", DataLabel(run), notes)
            {
                TimeZoneId = _options.TimeZone,
            },
            thermal,
            thumbnails,
            evaluation.Wires,
            evaluation.Statistics ?? EmptyStatistics(evaluation),
            evaluation.Model,
            run?.LEffNm ?? double.NaN,
            evaluation.Prediction,
            evaluation.Comparison,
            verdictInForce,
            diffusionFigures,
            DropletFigures.From(fields.SelectMany(f => f.Wires)));

        string summary = WaferReportDigestJson.Write(new WaferReportDigest(report.Statistics, evaluation.Prediction, verdictInForce,
            evaluation.Comparison is { } c ? new WaferAgreementDigest(c.Count, c.BiasNm, c.RmseNm, c.RSquared, c.MeanAbsoluteErrorNm) : null,
            diffusionFigures is null ? null : DiffusionDigest(diffusionFigures)));
        string verdict = verdictInForce.Outcome.ToString().ToLowerInvariant();
        var (reason, requester, answered) = await ReasonAsync(wafer, onDemand, cancellationToken).ConfigureAwait(false);
        if (evaluation.ModelFittedOnThisWafer)
        {
            modelId = "fitted on this wafer (proposed, not accepted)";
        }
        if (diffusionFigures is not null)
        {
            // The verdict's radius model is the accepted diffusion model; the Â regression is named beside it.
            modelId = string.Create(CultureInfo.InvariantCulture, $"diffusion radius model fit #{diffusionFigures.ModelFitId}; Â regression: {modelId}");
        }
        string configJson = ConfigJson(recipe, specification, unspecified);
        var (revision, written) = await ReportRevisionWriter.WriteAsync(report,
            new ReportRevisionRequest(wafer, folder, reason, requester, configJson, modelId, inputs, verdict, summary, answered),
            _revisions, report.Identity.SoftwareVersion, cancellationToken).ConfigureAwait(false);
        var files = new Dictionary<string, string>(StringComparer.Ordinal)
        {
            ["html"] = written.HtmlPath,
            ["pdf"] = written.PdfPath,
            ["csv"] = written.CsvPath,
            ["json"] = written.JsonPath,
        };
        foreach (var (format, path) in files)
        {
            await _wafers.SaveReportAsync(new WaferReportRecord(0, wafer, _time.GetUtcNow(), verdict, format, path, format == "json" ? summary : null), cancellationToken).ConfigureAwait(false);
        }
        Log.ReportWritten(_logger, wafer, verdict, revision.Folder);
        return new WaferReportOutcome(wafer, verdictInForce, revision.Folder, files) { Revision = revision };
    }

    /// <summary>Why the next revision is written and who asked, from the wafer's pending requests.</summary>
    private async Task<(string Reason, string Requester, IReadOnlyList<long> Answered)> ReasonAsync(string wafer, ReportRequestRecord? onDemand, CancellationToken cancellationToken)
    {
        IReadOnlyList<ReportRequestRecord> pending = await _revisions.GetPendingReportRequestsAsync(wafer, cancellationToken).ConfigureAwait(false);
        var reasons = new List<string>();
        var requesters = new List<string>();
        var ids = new List<long>();
        foreach (ReportRequestRecord r in onDemand is null ? pending : [.. pending, onDemand])
        {
            if (!reasons.Contains(r.Reason))
            {
                reasons.Add(r.Reason);
            }
            if (!requesters.Contains(r.Requester))
            {
                requesters.Add(r.Requester);
            }
            if (r.Id > 0)
            {
                ids.Add(r.Id);
            }
        }
        if (reasons.Count > 0)
        {
            return (string.Join("; ", reasons), string.Join(", ", requesters), ids);
        }
        bool issued = (await _revisions.GetReportRevisionsAsync(wafer, cancellationToken).ConfigureAwait(false)).Count > 0;
        return issued ? ("written again (no request recorded)", "daemon", []) : ("first issue", "intake", []);
    }

    /// <summary>The configuration and specification in force as canonical JSON (fixed property order, invariant numbers).</summary>
    private string ConfigJson(string recipe, QcSpecification specification, bool unspecified) =>
        System.Text.Json.JsonSerializer.Serialize(new
        {
            recipe,
            specificationInForce = unspecified ? null : specification,
            unspecified,
            pipeline = new
            {
                _options.DefaultPixelSizeNm,
                _options.PredictionSeed,
                _options.PredictionFields,
                _options.CaptureRadiusSearchMin,
                _options.CaptureRadiusSearchMax,
                _options.DefaultProcess,
            },
        }, PipelineJson.Options);

    private static WaferDiffusionDigest DiffusionDigest(DiffusionModelFigures d)
    {
        WaferDiffusionFigures f = d.Figures;
        return new WaferDiffusionDigest(d.ModelFitId, f.Method.ToString(), f.MeanTemperatureC, f.CoveredS, f.LambdaAtMeanUm * 1000,
            double.IsFinite(f.LambdaEffUm) ? f.LambdaEffUm * 1000 : null, f.LambdaMinUm * 1000, f.LambdaMaxUm * 1000, f.PredictedWires, f.GuardedWires, f.Extrapolated);
    }

    private static string UnspecifiedText(string recipe) =>
        $"No QC specification for recipe '{recipe}' and no default specification: judged against an unspecified specification (no limits); add one on the Settings page.";

    /// <summary>The verdict with one more rule that cannot pass: without a specification a wafer is at best WARN.</summary>
    private static QcVerdict Unspecified(QcVerdict verdict, string recipe) => verdict with
    {
        Outcome = verdict.Outcome > QcOutcome.Warn ? verdict.Outcome : QcOutcome.Warn,
        Rules = [.. verdict.Rules, new QcRuleResult("specification", "QC specification in force", null, "none", "none", "", QcOutcome.Warn, UnspecifiedText(recipe))],
    };


    /// <summary>Folder name for a wafer id: the report writer's safe file name, never a path.</summary>
    public static string SafeFolderName(string wafer)
    {
        // An id that is already a safe name keeps it. Any other (".COL", "_COL", "a/b") is reduced and gets "~" and
        // 16 hex digits of its SHA-256: the reduction is lossy, and "~" never survives it, so two distinct ids never
        // share a folder (a plain name has no "~"; two reduced ones differ in the hash).
        string safe = RunWatch.Reports.WaferReportWriter.SafeFileName(wafer);
        if (string.Equals(safe, wafer, StringComparison.Ordinal))
        {
            return safe;
        }
        string hash = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(wafer ?? "")))[..16];
        return safe + "~" + hash;
    }

    private async Task<(RadiusModelFit? Fit, string Id)> AcceptedModelAsync(string process, CancellationToken cancellationToken)
    {
        foreach (ModelFitRecord fit in await _wafers.GetModelFitsAsync(process, ModelKinds.Radius, 50, cancellationToken).ConfigureAwait(false))
        {
            if (fit.AcceptedAt is { } at)
            {
                return (ModelJson.Deserialize<RadiusModelFit>(fit.ParamsJson), string.Create(CultureInfo.InvariantCulture,
                    $"radius model fit #{fit.Id} of process {process}, accepted by {fit.AcceptedBy ?? "unknown"} at {at.UtcDateTime:yyyy-MM-dd HH:mm} UTC"));
            }
        }
        return (null, "none accepted");
    }

    private async Task<ThermalSummary> ThermalAsync(RunRecord? run, RunExcursions excursions, CancellationToken cancellationToken)
    {
        var times = new List<double>();
        var temps = new List<double>();
        double windowStart = 0;
        double windowEnd = 0;
        if (run is not null)
        {
            DateTimeOffset end = run.EndedAt ?? _time.GetUtcNow();
            var (channel, _) = await GrowthChannelAsync(run.Chamber, cancellationToken).ConfigureAwait(false);
            if (channel is not null)
            {
                foreach (SampleRecord s in await _store.GetSamplesAsync(run.Chamber, channel, run.StartedAt, end.AddTicks(1), 200_000, cancellationToken).ConfigureAwait(false))
                {
                    times.Add((s.Timestamp - run.StartedAt).TotalSeconds);
                    temps.Add(s.Value);
                }
            }
            (windowStart, windowEnd) = RunThermalSummary.GrowthWindowOf(run);
        }
        return new ThermalSummary(times, temps, run?.SetpointC, windowStart, windowEnd, excursions.Rows,
            run?.LNomNm ?? double.NaN, run?.LEffNm ?? double.NaN, run?.TEffC ?? double.NaN, RunThermalSummary.ConventionFactorOf(run),
            run?.Coverage ?? double.NaN, "gaps longer than the configured limit are reported and mark the run incomplete; nothing is interpolated across them");
    }

    private async Task<(string? Channel, string Unit)> GrowthChannelAsync(string chamber, CancellationToken cancellationToken)
    {
        foreach (RegisteredChamber c in await _store.ListChambersAsync(cancellationToken).ConfigureAwait(false))
        {
            if (c.Definition.Name != chamber)
            {
                continue;
            }
            foreach (RegisteredChannel ch in c.Channels)
            {
                if (ch.Definition.Role == ChannelRole.GrowthTemperature)
                {
                    return (ch.Definition.Name, ch.Definition.Unit);
                }
            }
        }
        return (null, "");
    }

    private static string Caption(FieldResult f) => string.Create(CultureInfo.InvariantCulture,
        $"{f.FieldName}: {f.Wires.Count} objects, {f.PixelSizeNm:0.##} nm/px, threshold {f.Threshold}");

    private static string DataLabel(RunRecord? run) => run is null ? "run unknown" : "recorded telemetry";

    private static WireStatistics EmptyStatistics(WaferEvaluation e) =>
        new(e.Wires.Count, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, 0, double.NaN);

}
