using System.Globalization;
using RunWatch.Imaging.Scale;
using RunWatch.Storage;
using RunWatch.Wafers.Pipeline;
using RunWatch.Web.Data.Fields;

namespace RunWatch.Hosting;

/// <summary>
/// The dashboard's Fields screen and re-analysis buttons, carried out by the wafer pipeline: uploads through
/// <see cref="FieldUploader"/> (the same path as <c>POST /api/fields/upload</c>, with the image decoded before it is
/// kept), the queue's state from the store and the analysis queue, re-analysis through <see cref="FieldIntake"/>
/// (audited with the user and the reason).
/// </summary>
internal sealed class PipelineFieldUploads(FieldUploader uploader, FieldIntake intake, FieldAnalysisQueue queue, IWaferStore wafers, IFieldListStore fields) : IFieldPipeline
{
    public long MaxUploadBytes => uploader.MaxBytes;

    public async Task<FieldUploadResult> UploadAsync(FieldUploadRequest request, Stream image, string user, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        FieldSidecar? sidecar;
        try
        {
            sidecar = SidecarOf(request);
        }
        catch (FieldSidecarException ex)
        {
            return FieldUploadResult.Refused("Refused: the sidecar is not valid: " + ex.Message + ". Nothing was stored.");
        }
        catch (ArgumentException ex)
        {
            return FieldUploadResult.Refused("Refused: " + ex.Message + ". Nothing was stored.");
        }
        FieldUploadOutcome outcome = await uploader.UploadAsync(request.FileName, image, sidecar, checkImage: true, cancellationToken).ConfigureAwait(false);
        if (outcome.Field is not { } field)
        {
            return FieldUploadResult.Refused($"Refused: {outcome.Problem}. Nothing was stored.");
        }
        string id = field.Id.ToString(CultureInfo.InvariantCulture);
        FieldQueueState state = FieldStates.Of(field, queue.IsRunning(field.Id));
        string message = !outcome.Added
            ? $"This image was taken in before, as field {id} ({FieldStates.Label(state).ToLowerInvariant()}); nothing new was stored."
            : state == FieldQueueState.Queued
                ? $"{request.FileName} uploaded by {user} as field {id} of wafer {field.Wafer}; queued for analysis."
            // The queue can take the field before this message is written; it was queued all the same.
            : state is FieldQueueState.Running or FieldQueueState.Done
                ? $"{request.FileName} uploaded by {user} as field {id} of wafer {field.Wafer}; queued for analysis (already started)."
                : $"{request.FileName} uploaded by {user} as field {id}, but it waits: {field.Problem}. Assign it on the wafer page once the wafer's run is known.";
        return new FieldUploadResult(true, id, field.Wafer, state, message);
    }

    public bool IsRunning(string fieldId) =>
        long.TryParse(fieldId, NumberStyles.None, CultureInfo.InvariantCulture, out long id) && queue.IsRunning(id);

    public async Task<IReadOnlyList<FieldQueueEntry>> GetRecentFieldsAsync(int maxCount, CancellationToken cancellationToken)
    {
        var list = new List<FieldQueueEntry>();
        foreach (FieldRecord f in await fields.GetRecentFieldsAsync(maxCount, cancellationToken).ConfigureAwait(false))
        {
            int? wires = null;
            if (f.Status == FieldStatus.Analysed)
            {
                wires = (await wafers.GetLatestAnalysisAsync(f.Id, cancellationToken).ConfigureAwait(false))?.WireCount;
            }
            list.Add(new FieldQueueEntry(f.Id.ToString(CultureInfo.InvariantCulture), f.RelativePath, f.Wafer, FieldStates.Of(f, queue.IsRunning(f.Id)),
                f.Problem, f.ImportedAt, wires));
        }
        return list;
    }

    public Task<int> ReanalyseWaferAsync(string waferId, string reason, string user, CancellationToken cancellationToken) =>
        intake.ReanalyseWaferAsync(waferId, user, reason, cancellationToken);

    public async Task ReanalyseFieldAsync(string fieldId, string reason, string user, CancellationToken cancellationToken)
    {
        if (!long.TryParse(fieldId, NumberStyles.None, CultureInfo.InvariantCulture, out long id))
        {
            throw new InvalidOperationException("no field with id " + fieldId);
        }
        try
        {
            await intake.ReanalyseFieldAsync(id, user, reason, cancellationToken).ConfigureAwait(false);
        }
        catch (KeyNotFoundException ex)
        {
            throw new InvalidOperationException(ex.Message, ex);
        }
    }

    /// <summary>The sidecar to write: the uploaded file's (checked), or one made of the form's fields, or none.</summary>
    private static FieldSidecar? SidecarOf(FieldUploadRequest request)
    {
        if (request.SidecarText is { } text)
        {
            if (request.HasFormFields)
            {
                throw new ArgumentException("give either a sidecar file or the form's fields, not both");
            }
            return FieldSidecar.Parse(text, "sidecar");
        }
        if (!request.HasFormFields)
        {
            return null;
        }
        var sidecar = new FieldSidecar
        {
            PixelSizeNm = request.PixelSizeNm,
            WaferId = string.IsNullOrWhiteSpace(request.WaferId) ? null : request.WaferId.Trim(),
            FieldPosition = request.PositionXMm is { } x && request.PositionYMm is { } y ? new FieldPosition(x, y)
                : request.PositionXMm is null && request.PositionYMm is null ? null
                : throw new ArgumentException("give both position x and y, or neither"),
            TiltDeg = request.TiltDeg,
            ExcludedBottomRows = request.ExcludedBottomRows,
        };
        sidecar.Validate("the form");
        return sidecar;
    }
}
