namespace RunWatch.Storage.Tests.Sqlite;

public sealed class SqliteMigratorTests
{
    [Fact]
    public async Task MigrateAsync_FreshFile_AppliesEveryScriptOnceAndRecordsVersions()
    {
        using var db = new TempDatabase();
        int first = await db.Store.MigrateAsync(CancellationToken.None);
        int second = await db.Store.MigrateAsync(CancellationToken.None);

        int scripts = RunWatch.Storage.Sqlite.SqliteMigrator.LoadScripts().Count;
        Assert.True(scripts >= 2);
        Assert.Equal(scripts, first);
        Assert.Equal(0, second);
        Assert.Equal(scripts, db.Count("SELECT COUNT(*) FROM schema_migrations"));
        Assert.Equal(1, db.Count("SELECT COUNT(*) FROM schema_migrations WHERE version = 1"));
        foreach (string table in new[] { "samples", "runs", "alerts", "dead_letters", "wafers", "fields", "analyses", "reports", "model_fits", "audit_entries" })
        {
            Assert.Equal(1, db.Count("SELECT COUNT(*) FROM sqlite_master WHERE type = 'table' AND name = '" + table + "'"));
        }
    }

    [Fact]
    public async Task MigrateAsync_Always_SetsWalJournal()
    {
        using var db = new TempDatabase();
        await db.Store.MigrateAsync(CancellationToken.None);
        using var connection = new Microsoft.Data.Sqlite.SqliteConnection("Data Source=" + db.Options.DatabasePath + ";Pooling=False");
        connection.Open();
        using var command = connection.CreateCommand();
        command.CommandText = "PRAGMA journal_mode";
        Assert.Equal("wal", (string)command.ExecuteScalar()!);
    }

    [Fact]
    public void LoadScripts_Always_ReturnsAscendingDistinctVersions()
    {
        var scripts = RunWatch.Storage.Sqlite.SqliteMigrator.LoadScripts();
        for (int i = 1; i < scripts.Count; i++)
        {
            Assert.True(scripts[i].Version > scripts[i - 1].Version);
        }
        Assert.Equal(1, scripts[0].Version);
    }
}
