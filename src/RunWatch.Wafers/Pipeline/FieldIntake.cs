using System.Security.Cryptography;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using RunWatch.Imaging.Scale;
using RunWatch.Wafers.Intake;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Takes an SEM image into the pipeline: fingerprints it, reads its sidecar, finds its wafer and that wafer's
/// run, stores the field and queues it for analysis, or leaves it unassigned with the reason. Used by the
/// drop-folder watcher, the upload endpoint and manual assignment. Never moves or changes the file.
/// </summary>
public sealed class FieldIntake
{
    private readonly IWaferStore _wafers;
    private readonly IRunWatchStore _store;
    private readonly FieldAnalysisQueue _queue;
    private readonly WaferIdResolver _resolver;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly IReportRevisionStore _revisions;

    public FieldIntake(IWaferStore wafers, IRunWatchStore store, FieldAnalysisQueue queue, string fileNamePattern, TimeProvider time, ILogger<FieldIntake>? logger = null)
    {
        _wafers = wafers;
        _revisions = wafers as IReportRevisionStore ?? throw new ArgumentException("the wafer store keeps no report revisions (IReportRevisionStore)", nameof(wafers));
        _store = store;
        _queue = queue;
        _resolver = new WaferIdResolver(fileNamePattern);
        _time = time;
        _logger = (ILogger?)logger ?? NullLogger.Instance;
    }

    /// <summary>Takes in one stable file. Returns the stored field and whether it was new.</summary>
    public async Task<(FieldRecord Field, bool Added)> TakeInAsync(ArrivedField arrived, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(arrived);
        string sha = await Sha256Async(arrived.FullPath, cancellationToken).ConfigureAwait(false);
        string? problem = null;
        FieldSidecar? sidecar = null;
        try
        {
            sidecar = FieldSidecar.TryLoadFor(arrived.FullPath);
        }
        catch (FieldSidecarException ex)
        {
            problem = ex.Message;
        }
        string? wafer = _resolver.Resolve(Path.GetFileName(arrived.RelativePath), sidecar?.WaferId);
        RunRecord? run = wafer is null ? null : await _wafers.FindRunOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false);
        if (wafer is not null)
        {
            await _wafers.UpsertWaferAsync(wafer, run?.Id, run?.Recipe, cancellationToken).ConfigureAwait(false);
        }
        FieldStatus status = problem is null && wafer is not null && run is not null ? FieldStatus.Queued : FieldStatus.Unassigned;
        problem ??= wafer is null
            ? "no wafer id in the file name or sidecar"
            : run is null ? $"no run has named wafer {wafer} yet" : null;
        var field = new FieldRecord
        {
            Wafer = wafer,
            FilePath = arrived.FullPath,
            RelativePath = arrived.RelativePath,
            Sha256 = sha,
            SizeBytes = arrived.SizeBytes,
            NmPerPx = sidecar?.PixelSizeNm,
            PositionXMm = sidecar?.FieldPosition?.XMm,
            PositionYMm = sidecar?.FieldPosition?.YMm,
            ImportedAt = _time.GetUtcNow(),
            Status = status,
            Problem = status == FieldStatus.Queued ? null : problem,
        };
        var (stored, added) = await _wafers.AddFieldAsync(field, cancellationToken).ConfigureAwait(false);
        if (!added)
        {
            return (stored, false);
        }
        if (stored.Status == FieldStatus.Queued)
        {
            Log.FieldTakenIn(_logger, arrived.RelativePath, wafer!, stored.Id);
            await RequestRevisionIfIssuedAsync(wafer!, "intake", "new field " + arrived.RelativePath, cancellationToken).ConfigureAwait(false);
            await _queue.EnqueueAsync(stored.Id, cancellationToken).ConfigureAwait(false);
        }
        else
        {
            Log.FieldUnassigned(_logger, arrived.RelativePath, stored.Problem ?? "unassigned");
        }
        return (stored, true);
    }

    /// <summary>Prefix of <see cref="FieldRecord.Problem"/> for a file refused at intake.</summary>
    public const string RefusedPrefix = "refused: ";

    /// <summary>
    /// Stores a file the drop folder or intake refused (a symbolic link, an empty file, a FIFO, an unreadable or
    /// oversize sidecar, any intake failure) as an unassigned field whose problem says why, so it is listed on the
    /// dashboard instead of only in a log line. One row per path: a second refusal of the same path changes nothing.
    /// </summary>
    public async Task<FieldRecord> RecordRefusalAsync(string fullPath, string relativePath, string reason, CancellationToken cancellationToken)
    {
        string key = "refused:" + Convert.ToHexStringLower(SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(relativePath)));
        var field = new FieldRecord
        {
            FilePath = fullPath,
            RelativePath = relativePath,
            Sha256 = key,
            ImportedAt = _time.GetUtcNow(),
            Status = FieldStatus.Unassigned,
            Problem = RefusedPrefix + reason,
        };
        var (stored, _) = await _wafers.AddFieldAsync(field, cancellationToken).ConfigureAwait(false);
        return stored;
    }

    /// <summary>A person assigns an unassigned field to a wafer; recorded in the audit trail with who did it.</summary>
    /// <exception cref="KeyNotFoundException">No such field.</exception>
    /// <exception cref="InvalidOperationException">The wafer id is not plausible, or no run names the wafer.</exception>
    public async Task<FieldRecord> AssignAsync(long fieldId, string wafer, string actor, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        if (!WaferIdResolver.IsPlausibleId(wafer))
        {
            throw new InvalidOperationException("a wafer id is 1–64 letters, digits, '-', '_' or '.'");
        }
        FieldRecord field = await _wafers.GetFieldAsync(fieldId, cancellationToken).ConfigureAwait(false)
            ?? throw new KeyNotFoundException("no field with id " + fieldId);
        if (field.Problem is { } refusal && refusal.StartsWith(RefusedPrefix, StringComparison.Ordinal))
        {
            throw new InvalidOperationException("this file was refused at intake (" + refusal[RefusedPrefix.Length..] + "); put a proper copy into the drop folder");
        }
        RunRecord run = await _wafers.FindRunOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false)
            ?? throw new InvalidOperationException($"no run has named wafer {wafer}; a field can only join a wafer whose run is known");
        await _wafers.UpsertWaferAsync(wafer, run.Id, run.Recipe, cancellationToken).ConfigureAwait(false);
        FieldRecord updated = await _wafers.UpdateFieldAsync(field with { Wafer = wafer, Status = FieldStatus.Queued, Problem = null }, cancellationToken).ConfigureAwait(false);
        await _store.AppendAuditAsync(new AuditEntry(_time.GetUtcNow(), actor, "assign-field", $"field {fieldId} → wafer {wafer}", null), cancellationToken).ConfigureAwait(false);
        await RequestRevisionIfIssuedAsync(wafer, actor, "field " + (field.RelativePath ?? fieldId.ToString(System.Globalization.CultureInfo.InvariantCulture)) + " assigned", cancellationToken).ConfigureAwait(false);
        await _queue.EnqueueAsync(updated.Id, cancellationToken).ConfigureAwait(false);
        return updated;
    }

    /// <summary>Queues again the unassigned fields whose wafer a run has named since they arrived. Returns how many.</summary>
    public async Task<int> RetryUnassignedAsync(CancellationToken cancellationToken)
    {
        int queued = 0;
        foreach (FieldRecord field in await _wafers.GetFieldsByStatusAsync(FieldStatus.Unassigned, 1000, cancellationToken).ConfigureAwait(false))
        {
            if (field.Wafer is null || field.Problem is { } p && !p.StartsWith("no run has named", StringComparison.Ordinal))
            {
                continue;
            }
            RunRecord? run = await _wafers.FindRunOfWaferAsync(field.Wafer, cancellationToken).ConfigureAwait(false);
            if (run is null)
            {
                continue;
            }
            await _wafers.UpsertWaferAsync(field.Wafer, run.Id, run.Recipe, cancellationToken).ConfigureAwait(false);
            await _wafers.UpdateFieldAsync(field with { Status = FieldStatus.Queued, Problem = null }, cancellationToken).ConfigureAwait(false);
            await _queue.EnqueueAsync(field.Id, cancellationToken).ConfigureAwait(false);
            queued++;
        }
        return queued;
    }

    /// <summary>Re-analyses every field of a wafer, on request (new settings or model). Returns how many were queued.</summary>
    public Task<int> ReanalyseWaferAsync(string wafer, string actor, CancellationToken cancellationToken) =>
        ReanalyseWaferAsync(wafer, actor, reason: null, cancellationToken);

    /// <summary>Re-analyses every analysed or failed field of a wafer, audited with who asked and why. Returns how many were queued.</summary>
    public async Task<int> ReanalyseWaferAsync(string wafer, string actor, string? reason, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        int queued = 0;
        bool requested = false;
        foreach (FieldRecord field in await _wafers.GetFieldsOfWaferAsync(wafer, cancellationToken).ConfigureAwait(false))
        {
            if (field.Status is FieldStatus.Analysed or FieldStatus.Failed)
            {
                if (!requested)
                {
                    // Stored before the fields are queued, so the revision written after them answers it.
                    string why = "re-analysis requested" + (string.IsNullOrWhiteSpace(reason) ? "" : ": " + reason.Trim());
                    await _revisions.AddReportRequestAsync(new ReportRequestRecord(0, wafer, _time.GetUtcNow(), actor, why), cancellationToken).ConfigureAwait(false);
                    requested = true;
                }
                await _wafers.UpdateFieldAsync(field with { Status = FieldStatus.Queued, Problem = null }, cancellationToken).ConfigureAwait(false);
                await _queue.EnqueueAsync(field.Id, cancellationToken).ConfigureAwait(false);
                queued++;
            }
        }
        await _store.AppendAuditAsync(new AuditEntry(_time.GetUtcNow(), actor, "reanalyse-wafer", wafer,
            string.IsNullOrWhiteSpace(reason) ? null : AuditDetail.Json(reason)), cancellationToken).ConfigureAwait(false);
        return queued;
    }

    /// <summary>A wafer whose report was issued gets a request for its next revision, saying why and who asked.</summary>
    private async Task RequestRevisionIfIssuedAsync(string wafer, string requester, string reason, CancellationToken cancellationToken)
    {
        if ((await _revisions.GetReportRevisionsAsync(wafer, cancellationToken).ConfigureAwait(false)).Count > 0)
        {
            await _revisions.AddReportRequestAsync(new ReportRequestRecord(0, wafer, _time.GetUtcNow(), requester, reason), cancellationToken).ConfigureAwait(false);
        }
    }

    /// <summary>Re-analyses one field on request, audited with who asked and why.</summary>
    /// <exception cref="KeyNotFoundException">No such field.</exception>
    /// <exception cref="InvalidOperationException">The field is not analysed or failed (it waits for a wafer, or is queued already).</exception>
    public async Task<FieldRecord> ReanalyseFieldAsync(long fieldId, string actor, string reason, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(actor);
        ArgumentException.ThrowIfNullOrWhiteSpace(reason);
        FieldRecord field = await _wafers.GetFieldAsync(fieldId, cancellationToken).ConfigureAwait(false)
            ?? throw new KeyNotFoundException("no field with id " + fieldId);
        if (field.Status is not (FieldStatus.Analysed or FieldStatus.Failed))
        {
            throw new InvalidOperationException(field.Status == FieldStatus.Queued
                ? $"field {fieldId} is queued for analysis already"
                : $"field {fieldId} has no wafer yet ({field.Problem ?? "unassigned"}); assign it first");
        }
        FieldRecord updated = await _wafers.UpdateFieldAsync(field with { Status = FieldStatus.Queued, Problem = null }, cancellationToken).ConfigureAwait(false);
        await _store.AppendAuditAsync(new AuditEntry(_time.GetUtcNow(), actor, "reanalyse-field", $"field {fieldId} of wafer {field.Wafer}", AuditDetail.Json(reason)), cancellationToken).ConfigureAwait(false);
        await _queue.EnqueueAsync(updated.Id, cancellationToken).ConfigureAwait(false);
        return updated;
    }

    private static async Task<string> Sha256Async(string path, CancellationToken cancellationToken)
    {
        await using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite, 1 << 16, useAsync: true);
        byte[] hash = await SHA256.HashDataAsync(stream, cancellationToken).ConfigureAwait(false);
        return Convert.ToHexStringLower(hash);
    }
}
