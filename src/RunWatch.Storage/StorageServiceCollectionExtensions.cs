using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Npgsql;
using RunWatch.Storage.Postgres;
using RunWatch.Storage.Sqlite;

namespace RunWatch.Storage;

/// <summary>Registers the store.</summary>
public static class StorageServiceCollectionExtensions
{
    /// <summary>
    /// Binds and validates <see cref="StorageOptions"/> from the <c>Storage</c> section and registers the store chosen
    /// by <c>Storage:Provider</c> (SQLite, or PostgreSQL with <c>Storage:ConnectionString</c>) as a singleton behind
    /// <see cref="IRunWatchStore"/>, <see cref="IWaferStore"/> and <see cref="ISettingsStore"/>, and the
    /// <see cref="QcSpecificationCatalog"/> over it. Call <see cref="IRunWatchStore.MigrateAsync"/> at start.
    /// </summary>
    public static IServiceCollection AddRunWatchStorage(this IServiceCollection services, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(services);
        ArgumentNullException.ThrowIfNull(configuration);
        services.AddOptions<StorageOptions>()
            .Bind(configuration.GetSection(StorageOptions.SectionName))
            .ValidateDataAnnotations()
            .Validate(o => o.BusyTimeout > TimeSpan.Zero, "Storage:BusyTimeout must be positive")
            .Validate(o => !o.UsesPostgres || !string.IsNullOrWhiteSpace(o.ConnectionString),
                "Storage:ConnectionString is required with Storage:Provider=PostgreSql (e.g. Host=127.0.0.1;Port=5432;Database=runwatch;Username=runwatch)")
            .Validate(o => !o.UsesPostgres || string.IsNullOrWhiteSpace(o.ConnectionString) || IsReadableConnectionString(o.ConnectionString),
                "Storage:ConnectionString is not a valid Npgsql connection string (keywords such as Host, Port, Database, Username)")
            .Validate(o => !o.UsesPostgres || !DisablesPooling(o.ConnectionString),
                "Storage:ConnectionString must not set Pooling=false: the store keeps its own pooled connections (ownership locks use separate ones)")
            .ValidateOnStart();
        services.TryAddSingleton(TimeProvider.System);
        string provider = configuration.GetSection(StorageOptions.SectionName)[nameof(StorageOptions.Provider)] ?? "Sqlite";
        if (string.Equals(provider, "PostgreSql", StringComparison.OrdinalIgnoreCase))
        {
            services.TryAddSingleton<PostgresRunWatchStore>();
            services.TryAddSingleton<IRunWatchStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
            services.TryAddSingleton<IWaferStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
            services.TryAddSingleton<ISettingsStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
            services.TryAddSingleton<IReminderBindingStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
            services.TryAddSingleton<IReportRevisionStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
            services.TryAddSingleton<INoteStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
            services.TryAddSingleton<IFieldListStore>(sp => sp.GetRequiredService<PostgresRunWatchStore>());
        }
        else
        {
            services.TryAddSingleton<SqliteRunWatchStore>();
            services.TryAddSingleton<IRunWatchStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
            services.TryAddSingleton<IWaferStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
            services.TryAddSingleton<ISettingsStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
            services.TryAddSingleton<IReminderBindingStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
            services.TryAddSingleton<IReportRevisionStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
            services.TryAddSingleton<INoteStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
            services.TryAddSingleton<IFieldListStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
        }
        services.TryAddSingleton<QcSpecificationCatalog>();
        return services;
    }

    private static bool IsReadableConnectionString(string value)
    {
        try
        {
            _ = new NpgsqlConnectionStringBuilder(value);
            return true;
        }
        catch (ArgumentException)
        {
            return false;
        }
    }

    private static bool DisablesPooling(string? value)
    {
        if (string.IsNullOrWhiteSpace(value) || !IsReadableConnectionString(value))
        {
            return false;
        }
        return !new NpgsqlConnectionStringBuilder(value).Pooling;
    }
}
