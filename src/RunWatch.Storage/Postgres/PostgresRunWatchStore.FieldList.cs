namespace RunWatch.Storage.Postgres;

/// <summary>The newest fields in any state.</summary>
public sealed partial class PostgresRunWatchStore : IFieldListStore
{
    /// <inheritdoc />
    public Task<IReadOnlyList<FieldRecord>> GetRecentFieldsAsync(int maxCount, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<FieldRecord>>(async connection =>
            await SelectFieldsAsync(connection, null, "f.id > @key ORDER BY f.imported_us DESC, f.id DESC", 0L, Math.Max(0, maxCount), cancellationToken).ConfigureAwait(false),
            cancellationToken);
}
