namespace RunWatch.Web.Data.Fields;

/// <summary>
/// The wafer pipeline as the dashboard drives it: upload, the queue's state per field, re-analysis on request.
/// Implemented by the host over the wafer room; callers check the role first. Every action is audited with the user.
/// </summary>
public interface IFieldPipeline
{
    /// <summary>Largest upload accepted, bytes.</summary>
    long MaxUploadBytes { get; }

    /// <summary>Stores the image (and its sidecar) in the drop folder's uploads and takes it in; a refusal stores nothing.</summary>
    Task<FieldUploadResult> UploadAsync(FieldUploadRequest request, Stream image, string user, CancellationToken cancellationToken);

    /// <summary>Whether the field is being analysed now.</summary>
    bool IsRunning(string fieldId);

    /// <summary>The newest fields (any state), newest first.</summary>
    Task<IReadOnlyList<FieldQueueEntry>> GetRecentFieldsAsync(int maxCount, CancellationToken cancellationToken);

    /// <summary>Queues every analysed or failed field of the wafer again; returns how many.</summary>
    Task<int> ReanalyseWaferAsync(string waferId, string reason, string user, CancellationToken cancellationToken);

    /// <summary>Queues one field again.</summary>
    /// <exception cref="InvalidOperationException">The field is unknown or not in a state to re-analyse; the message says why.</exception>
    Task ReanalyseFieldAsync(string fieldId, string reason, string user, CancellationToken cancellationToken);
}
