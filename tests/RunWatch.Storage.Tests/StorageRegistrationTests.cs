using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using RunWatch.Storage.Postgres;
using RunWatch.Storage.Sqlite;

namespace RunWatch.Storage.Tests;

/// <summary>Storage:Provider picks the store; bad store options are refused at start with a message naming the key.</summary>
public sealed class StorageRegistrationTests
{
    private static ServiceProvider Build(params (string Key, string Value)[] settings)
    {
        var configuration = new ConfigurationBuilder()
            .AddInMemoryCollection(settings.Select(s => new KeyValuePair<string, string?>(s.Key, s.Value)))
            .Build();
        return new ServiceCollection().AddRunWatchStorage(configuration).BuildServiceProvider();
    }

    [Fact]
    public void AddRunWatchStorage_PostgreSqlProvider_EveryStoreInterfaceIsThePostgresStore()
    {
        using var services = Build(("Storage:Provider", "PostgreSql"), ("Storage:ConnectionString", "Host=127.0.0.1;Port=1;Database=x;Username=y"));

        var store = services.GetRequiredService<IRunWatchStore>();

        Assert.IsType<PostgresRunWatchStore>(store);
        Assert.Same(store, services.GetRequiredService<IWaferStore>());
        Assert.Same(store, services.GetRequiredService<ISettingsStore>());
    }

    [Fact]
    public void AddRunWatchStorage_NoProvider_SqliteStore()
    {
        using var services = Build(("Storage:DataDirectory", Path.GetTempPath()));

        Assert.IsType<SqliteRunWatchStore>(services.GetRequiredService<IRunWatchStore>());
        Assert.Same(services.GetRequiredService<IRunWatchStore>(), services.GetRequiredService<IWaferStore>());
    }

    [Theory]
    [InlineData("Oracle", null, "Storage:Provider must be Sqlite or PostgreSql")]
    [InlineData("PostgreSql", null, "Storage:ConnectionString is required")]
    [InlineData("PostgreSql", "Host=127.0.0.1;Nonsense Keyword=1", "not a valid Npgsql connection string")]
    [InlineData("PostgreSql", "Host=127.0.0.1;Database=x;Pooling=false", "must not set Pooling=false")]
    public void StorageOptions_BadSettings_RefusedWithTheKeyInTheMessage(string provider, string? connectionString, string expected)
    {
        var settings = new List<(string, string)> { ("Storage:Provider", provider) };
        if (connectionString is not null)
        {
            settings.Add(("Storage:ConnectionString", connectionString));
        }
        using var services = Build([.. settings]);

        var ex = Assert.Throws<OptionsValidationException>(() => services.GetRequiredService<IOptions<StorageOptions>>().Value);

        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }
}
