using RunWatch.Ingest.Chambers;
using RunWatch.Storage;

namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// Sees every batch right after it is committed (run tracker, alert engine). Called on the committer's thread, so it
/// must be quick and must not block; slow work goes to its own queue. Exceptions are caught and logged by the caller.
/// </summary>
internal interface ICommittedBatchObserver
{
    /// <summary>Handles the committed samples (with <see cref="IngestBatch.Inserted"/> telling new from duplicate) and events.</summary>
    void OnCommitted(IngestBatch batch, IReadOnlyList<ChamberEvent> events, DateTimeOffset committedAt);
}
