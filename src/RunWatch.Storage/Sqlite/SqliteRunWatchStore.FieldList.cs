namespace RunWatch.Storage.Sqlite;

/// <summary>The newest fields in any state.</summary>
public sealed partial class SqliteRunWatchStore : IFieldListStore
{
    /// <inheritdoc />
    public Task<IReadOnlyList<FieldRecord>> GetRecentFieldsAsync(int maxCount, CancellationToken cancellationToken) =>
        ReadAsync(connection => SelectFields(connection, "f.id > $key ORDER BY f.imported_us DESC, f.id DESC", 0L, Math.Max(0, maxCount)), cancellationToken);
}
