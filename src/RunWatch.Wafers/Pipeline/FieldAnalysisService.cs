using System.Diagnostics;
using System.Text.Json;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Imaging.Analysis;
using RunWatch.Imaging.Decoding;
using RunWatch.Imaging.Scale;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Analyses queued fields one at a time with the run's L_eff, stores each result, and writes the wafer's report
/// once none of its fields is waiting. A field that cannot be analysed is marked failed with the reason; the
/// service itself never stops on a bad image.
/// </summary>
public sealed class FieldAnalysisService(
    FieldAnalysisQueue queue,
    IWaferStore wafers,
    WaferReportService reports,
    IOptions<WaferPipelineOptions> options,
    TimeProvider time,
    ILogger<FieldAnalysisService> logger,
    IOptions<QcOptions>? qc = null,
    QcSpecificationCatalog? specifications = null) : BackgroundService
{
    // Who holds a field while it is analysed: daemons sharing one store (fleet mode) each claim a field before
    // analysing it, so a field is analysed once; a claim of a daemon that died runs out after the lease.
    private static readonly string Worker = Environment.MachineName + ":" + Environment.ProcessId.ToString(System.Globalization.CultureInfo.InvariantCulture);
    private static readonly TimeSpan ClaimLease = TimeSpan.FromMinutes(15);

    /// <summary>Raised after a wafer's report was written (for the dashboard and the demo).</summary>
    public event Action<WaferReportOutcome>? ReportWritten;

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        // Fields queued before a restart are picked up again: the queue itself lives in memory.
        foreach (FieldRecord waiting in await wafers.GetFieldsByStatusAsync(FieldStatus.Queued, 10_000, stoppingToken).ConfigureAwait(false))
        {
            await queue.EnqueueAsync(waiting.Id, stoppingToken).ConfigureAwait(false);
        }
        await foreach (long fieldId in queue.Reader.ReadAllAsync(stoppingToken).ConfigureAwait(false))
        {
            queue.Started(fieldId);
            bool ok = false;
            string? wafer = null;
            try
            {
                (ok, wafer) = await AnalyseAsync(fieldId, stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                queue.Finished(fieldId, false);
                throw;
            }
            catch (Exception ex) when (ex is IOException or InvalidDataException or JsonException or StoreUnavailableException or InvalidOperationException or ArgumentException)
            {
                Log.FieldFailed(logger, fieldId, ex.Message);
            }
            queue.Finished(fieldId, ok);
            if (wafer is not null && await NothingWaitingAsync(wafer, stoppingToken).ConfigureAwait(false))
            {
                await WriteReportAsync(wafer, stoppingToken).ConfigureAwait(false);
            }
        }
    }

    /// <summary>
    /// The droplet contact angle of the wafer's process, from its QC specification (the stored one where the store keeps
    /// them, else configuration; recipe as the report resolves it): the analysis turns bare droplets into wire radii with it.
    /// Null when the process has no specification or no angle.
    /// </summary>
    internal async Task<double?> ContactAngleAsync(string wafer, RunRecord? run, CancellationToken cancellationToken)
    {
        string recipe = run?.Recipe ?? (await wafers.GetWaferAsync(wafer, cancellationToken).ConfigureAwait(false))?.Process ?? options.Value.DefaultProcess;
        try
        {
            QcSpecification? specification = specifications is not null
                ? await specifications.SpecificationForAsync(recipe, cancellationToken).ConfigureAwait(false)
                : qc?.Value.SpecificationFor(recipe);
            return specification?.DropletContactAngleDeg;
        }
        catch (KeyNotFoundException)
        {
            return null;
        }
    }

    /// <summary>Analyses one field; returns whether it succeeded and the wafer it belongs to.</summary>
    internal async Task<(bool Ok, string? Wafer)> AnalyseAsync(long fieldId, CancellationToken cancellationToken)
    {
        FieldRecord? field = await wafers.GetFieldAsync(fieldId, cancellationToken).ConfigureAwait(false);
        if (field is null || field.Status != FieldStatus.Queued || field.Wafer is null)
        {
            return (false, null);
        }
        if (!await wafers.ClaimFieldAsync(field.Id, Worker, time.GetUtcNow(), ClaimLease, cancellationToken).ConfigureAwait(false))
        {
            // Another daemon of the fleet is analysing it.
            return (false, null);
        }
        RunRecord? run = await wafers.FindRunOfWaferAsync(field.Wafer, cancellationToken).ConfigureAwait(false);
        DateTimeOffset started = time.GetUtcNow();
        var settings = new FieldAnalysisOptions
        {
            PixelSizeNm = options.Value.DefaultPixelSizeNm,
            DiffusionLengthNm = run?.LEffNm,
            DropletContactAngleDeg = await ContactAngleAsync(field.Wafer, run, cancellationToken).ConfigureAwait(false),
        };
        var clock = Stopwatch.StartNew();
        TimeSpan budget = options.Value.FieldAnalysisBudget;
        using var overBudget = new CancellationTokenSource(budget, time);
        using var analysisStop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken, overBudget.Token);
        try
        {
            (FieldAnalysis Analysis, FieldRaster Raster) analysed;
            try
            {
                // The analysis watches the token in its per-wire, per-row and per-point loops, so past its budget the
                // work itself stops and the queue goes on. The wait's own limit (half a budget more) is only a
                // backstop for a stage that does not check.
                analysed = await Task.Run(() => FieldAnalyzer.AnalyzeWithRaster(field.FilePath, settings, analysisStop.Token), analysisStop.Token)
                    .WaitAsync(budget + (budget / 2), time, cancellationToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (overBudget.IsCancellationRequested && !cancellationToken.IsCancellationRequested)
            {
                throw new TimeoutException("over budget");
            }
            var (analysis, raster) = analysed;
            FieldResult result = FieldResultMapper.From(analysis);
            await OverlayWriter.WriteAsync(analysis, raster, WaferFiles.OverlayPath(reports.FolderFor(field.Wafer), field.Id), cancellationToken).ConfigureAwait(false);
            await wafers.SaveAnalysisAsync(new AnalysisRecord
            {
                FieldId = field.Id,
                StartedAt = started,
                FinishedAt = time.GetUtcNow(),
                Status = "done",
                WireCount = analysis.Wires.Count,
                DiffusionLengthNm = run?.LEffNm,
                SettingsJson = JsonSerializer.Serialize(new { settings.PixelSizeNm, settings.DiffusionLengthNm, settings.ManualThreshold, settings.MinWireAreaPixels, settings.DropletContactAngleDeg }, PipelineJson.Options),
                ResultsJson = FieldResultJson.Write(result),
            }, cancellationToken).ConfigureAwait(false);
            await wafers.UpdateFieldAsync(field with
            {
                Status = FieldStatus.Analysed,
                Problem = analysis.NoWiresFound ? "no wires found" : null,
                WidthPx = analysis.Width,
                HeightPx = analysis.Height,
                NmPerPx = analysis.Scale.PixelSizeNm,
                PositionXMm = field.PositionXMm ?? analysis.FieldPosition?.XMm,
                PositionYMm = field.PositionYMm ?? analysis.FieldPosition?.YMm,
            }, cancellationToken).ConfigureAwait(false);
            Log.FieldAnalysed(logger, field.Id, analysis.Wires.Count, clock.ElapsedMilliseconds);
            return (true, field.Wafer);
        }
        catch (Exception ex) when (ex is ImageDecodeException or FieldSidecarException or InvalidOperationException or IOException or ArgumentException or TimeoutException)
        {
            if (ex is TimeoutException)
            {
                ex = new TimeoutException("analysis took longer than its budget (WaferPipeline:FieldAnalysisBudget " + options.Value.FieldAnalysisBudget.ToString() + "); the field is skipped");
            }
            Log.FieldFailed(logger, field.Id, ex.Message);
            await wafers.SaveAnalysisAsync(new AnalysisRecord
            {
                FieldId = field.Id,
                StartedAt = started,
                FinishedAt = time.GetUtcNow(),
                Status = "failed",
                Problem = ex.Message,
                DiffusionLengthNm = run?.LEffNm,
            }, cancellationToken).ConfigureAwait(false);
            await wafers.UpdateFieldAsync(field with { Status = FieldStatus.Failed, Problem = ex.Message }, cancellationToken).ConfigureAwait(false);
            return (false, field.Wafer);
        }
    }

    private async Task<bool> NothingWaitingAsync(string wafer, CancellationToken cancellationToken)
    {
        bool anyAnalysed = false;
        foreach (FieldRecord f in await wafers.GetFieldsOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false))
        {
            if (f.Status == FieldStatus.Queued)
            {
                return false;
            }
            anyAnalysed |= f.Status == FieldStatus.Analysed;
        }
        return anyAnalysed;
    }

    private async Task WriteReportAsync(string wafer, CancellationToken cancellationToken)
    {
        try
        {
            WaferReportOutcome outcome = await reports.WriteAsync(wafer, cancellationToken).ConfigureAwait(false);
            ReportWritten?.Invoke(outcome);
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            throw;
        }
        catch (Exception ex)
        {
            // A report that cannot be written must not stop the analysis of other wafers.
            Log.ReportFailed(logger, wafer, ex);
        }
    }
}
