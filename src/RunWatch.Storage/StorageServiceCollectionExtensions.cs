using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using RunWatch.Storage.Sqlite;

namespace RunWatch.Storage;

/// <summary>Registers the store.</summary>
public static class StorageServiceCollectionExtensions
{
    /// <summary>
    /// Binds and validates <see cref="StorageOptions"/> from the <c>Storage</c> section and registers
    /// <see cref="IRunWatchStore"/> (SQLite) as a singleton, with its <see cref="ISettingsStore"/> and the
    /// <see cref="QcSpecificationCatalog"/> over it. Call <see cref="IRunWatchStore.MigrateAsync"/> at start.
    /// </summary>
    public static IServiceCollection AddRunWatchStorage(this IServiceCollection services, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(services);
        ArgumentNullException.ThrowIfNull(configuration);
        services.AddOptions<StorageOptions>()
            .Bind(configuration.GetSection(StorageOptions.SectionName))
            .ValidateDataAnnotations()
            .Validate(o => string.Equals(o.Provider, "Sqlite", StringComparison.OrdinalIgnoreCase), "Storage:Provider must be Sqlite (PostgreSQL is not available yet)")
            .Validate(o => o.BusyTimeout > TimeSpan.Zero, "Storage:BusyTimeout must be positive")
            .ValidateOnStart();
        services.TryAddSingleton(TimeProvider.System);
        services.TryAddSingleton<SqliteRunWatchStore>();
        services.TryAddSingleton<IRunWatchStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
        services.TryAddSingleton<ISettingsStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
        services.TryAddSingleton<IReminderBindingStore>(sp => sp.GetRequiredService<SqliteRunWatchStore>());
        services.TryAddSingleton<QcSpecificationCatalog>();
        return services;
    }
}
