namespace RunWatch.Storage.Tests.Contract;

/// <summary>The store implementations the contract suite runs against.</summary>
public enum StoreKind
{
    /// <summary>SqliteRunWatchStore on a temporary file.</summary>
    Sqlite,

    /// <summary>PostgresRunWatchStore on a fresh database of the test PostgreSQL server.</summary>
    PostgreSql,
}
