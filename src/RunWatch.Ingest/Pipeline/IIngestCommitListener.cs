namespace RunWatch.Ingest.Pipeline;

/// <summary>
/// Told after each batch is committed (and so acknowledged): the new samples, and which chambers had run events.
/// For live views such as the dashboard; called on the ingest consumer, so implementations must return quickly and
/// must not throw.
/// </summary>
public interface IIngestCommitListener
{
    void Committed(IReadOnlyList<CommittedSample> samples, IReadOnlyCollection<string> chambersWithEvents);
}
