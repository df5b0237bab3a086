using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Web.Data;
using RunWatch.Web.Data.Store;

namespace RunWatch.Web.Tests.Support;

/// <summary>
/// The dashboard's store-backed data on a real SQLite file in a temp folder, with the QC specification catalog
/// seeded from an invented configuration. <see cref="Reopen"/> disposes the store and opens the same file again, as a restart does.
/// </summary>
internal sealed class StoreHarness : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-web-settings-").FullName;

    public StoreHarness(IModelRefitter? refitter = null)
    {
        Refitter = refitter;
        Open();
    }

    /// <summary>Configuration's specification of the invented recipe nw-inv.</summary>
    public static QcOptions Config => new()
    {
        Recipes =
        {
            ["nw-inv"] = new QcSpecification
            {
                TargetMeanRadiusNm = 45, MeanRadiusToleranceNm = 10, MeanRadiusWarnToleranceNm = 5, MaxRadiusCv = 0.35, WarnRadiusCv = 0.3,
                MinVerticalYield = 0.7, MinWireCount = 50,
            },
        },
    };

    public IModelRefitter? Refitter { get; }

    public SqliteRunWatchStore Store { get; private set; } = default!;

    public QcSpecificationCatalog Catalog { get; private set; } = default!;

    public StoreWaferData Wafers { get; private set; } = default!;

    public StoreDashboardData Data { get; private set; } = default!;

    public void Reopen()
    {
        Store.Dispose();
        SqliteConnection.ClearAllPools();
        Open();
    }

    public void Dispose()
    {
        Store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    private void Open()
    {
        Store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
        Store.MigrateAsync(CancellationToken.None).GetAwaiter().GetResult();
        Catalog = new QcSpecificationCatalog(Store, Options.Create(Config), TimeProvider.System);
        Wafers = new StoreWaferData(Store);
        Data = new StoreDashboardData(Store, new NoAlertCommands(), TimeProvider.System, Options.Create(new DashboardOptions()), Wafers, null, Catalog, Refitter);
    }

    /// <summary>Alert commands are not exercised here.</summary>
    private sealed class NoAlertCommands : IAlertCommands
    {
        public Task<bool> AcknowledgeAsync(long alertId, string user, string? comment, CancellationToken cancellationToken) => Task.FromResult(false);

        public Task<bool> ShelveAsync(long alertId, TimeSpan duration, string user, string? comment, CancellationToken cancellationToken) => Task.FromResult(false);
    }
}
