namespace RunWatch.Storage;

/// <summary>The newest SEM fields in any state, for the dashboard's queue list. Thread-safe.</summary>
public interface IFieldListStore
{
    /// <summary>The <paramref name="maxCount"/> fields taken in last, newest first (ties: higher id first).</summary>
    Task<IReadOnlyList<FieldRecord>> GetRecentFieldsAsync(int maxCount, CancellationToken cancellationToken);
}
