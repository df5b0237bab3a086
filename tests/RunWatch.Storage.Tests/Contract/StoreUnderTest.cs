using Microsoft.Data.Sqlite;
using Npgsql;
using RunWatch.Storage.Postgres;
using RunWatch.Storage.Sqlite;
using RunWatch.Testing.Postgres;

namespace RunWatch.Storage.Tests.Contract;

/// <summary>
/// A fresh store of either kind for one test: SQLite on a temporary file, or PostgreSQL on a new database of the test
/// server (<see cref="PostgresServer.SharedAsync"/>). Counts rows through an independent connection, not the store.
/// </summary>
internal sealed class StoreUnderTest : IAsyncDisposable
{
    private readonly string? _folder;
    private readonly PostgresServer? _server;
    private object _store;

    private StoreUnderTest(StoreKind kind, StorageOptions options, string? folder, PostgresServer? server)
    {
        Kind = kind;
        Options = options;
        _folder = folder;
        _server = server;
        _store = Open();
    }

    public StoreKind Kind { get; }

    public StorageOptions Options { get; }

    public IRunWatchStore Store => (IRunWatchStore)_store;

    public IWaferStore Wafers => (IWaferStore)_store;

    public ISettingsStore Settings => (ISettingsStore)_store;

    public IReminderBindingStore ReminderBindings => (IReminderBindingStore)_store;

    public IReportRevisionStore Revisions => (IReportRevisionStore)_store;
    public INoteStore Notes => (INoteStore)_store;

    public static async Task<StoreUnderTest> CreateAsync(StoreKind kind, Action<StorageOptions>? configure = null)
    {
        if (kind == StoreKind.Sqlite)
        {
            string folder = Directory.CreateTempSubdirectory("runwatch-store-").FullName;
            var sqliteOptions = new StorageOptions { DataDirectory = folder, DatabaseFile = "test.db" };
            configure?.Invoke(sqliteOptions);
            return new StoreUnderTest(kind, sqliteOptions, folder, null);
        }
        var server = await PostgresServer.SharedAsync();
        var options = new StorageOptions { Provider = "PostgreSql", ConnectionString = await server.CreateDatabaseAsync("contract") };
        configure?.Invoke(options);
        return new StoreUnderTest(kind, options, null, server);
    }

    /// <summary>Closes the store and opens a new one on the same database, as after a daemon restart.</summary>
    public async Task ReopenAsync()
    {
        await CloseAsync();
        _store = Open();
    }

    /// <summary>A scalar count through an independent connection.</summary>
    public async Task<long> CountAsync(string sql)
    {
        if (Kind == StoreKind.Sqlite)
        {
            await using var sqlite = new SqliteConnection("Data Source=" + Options.DatabasePath + ";Pooling=False");
            sqlite.Open();
            await using var sqliteCommand = sqlite.CreateCommand();
            sqliteCommand.CommandText = sql;
            return Convert.ToInt64(sqliteCommand.ExecuteScalar(), System.Globalization.CultureInfo.InvariantCulture);
        }
        await using var connection = new NpgsqlConnection(new NpgsqlConnectionStringBuilder(Options.ConnectionString) { Pooling = false }.ConnectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        return Convert.ToInt64(await command.ExecuteScalarAsync(), System.Globalization.CultureInfo.InvariantCulture);
    }

    public async ValueTask DisposeAsync()
    {
        await CloseAsync();
        if (_folder is not null)
        {
            Directory.Delete(_folder, recursive: true);
        }
        if (_server is not null)
        {
            await _server.DropDatabaseAsync(Options.ConnectionString!);
        }
    }

    private object Open() => Kind == StoreKind.Sqlite
        ? new SqliteRunWatchStore(Microsoft.Extensions.Options.Options.Create(Options), TimeProvider.System)
        : new PostgresRunWatchStore(Microsoft.Extensions.Options.Options.Create(Options), TimeProvider.System);

    private async Task CloseAsync()
    {
        switch (_store)
        {
            case PostgresRunWatchStore postgres:
                await postgres.DisposeAsync();
                break;
            case SqliteRunWatchStore sqlite:
                sqlite.Dispose();
                SqliteConnection.ClearAllPools();
                break;
        }
    }
}
