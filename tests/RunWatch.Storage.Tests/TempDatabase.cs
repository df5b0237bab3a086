using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Storage.Sqlite;

namespace RunWatch.Storage.Tests;

/// <summary>A SQLite store on a temporary file, deleted on dispose.</summary>
internal sealed class TempDatabase : IDisposable
{
    public TempDatabase(Action<StorageOptions>? configure = null)
    {
        Folder = Directory.CreateTempSubdirectory("runwatch-store-").FullName;
        Options = new StorageOptions { DataDirectory = Folder, DatabaseFile = "test.db" };
        configure?.Invoke(Options);
        Store = new SqliteRunWatchStore(Microsoft.Extensions.Options.Options.Create(Options), TimeProvider.System);
    }

    public string Folder { get; }

    public StorageOptions Options { get; }

    public SqliteRunWatchStore Store { get; }

    public static ChamberDefinition Chamber(string name = "C1") => new(name, "lab", "invented test chamber",
    [
        new ChannelDefinition("substrate_tc", ChannelRole.GrowthTemperature, "degC", -50, 1200, [new CalibrationPoint(600, 605)]),
        new ChannelDefinition("substrate_sp", ChannelRole.Setpoint, "degC", null, null, []),
        new ChannelDefinition("ga_shutter", ChannelRole.GrowthShutter, "1", 0, 1, []),
    ]);

    /// <summary>Counts rows with an independent connection, not through the store.</summary>
    public long Count(string sql)
    {
        using var connection = new SqliteConnection("Data Source=" + Options.DatabasePath + ";Pooling=False");
        connection.Open();
        using var command = connection.CreateCommand();
        command.CommandText = sql;
        return (long)command.ExecuteScalar()!;
    }

    public void Dispose()
    {
        Store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(Folder, recursive: true);
    }
}
