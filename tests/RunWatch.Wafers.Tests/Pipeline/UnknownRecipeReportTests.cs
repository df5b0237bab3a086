using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>A wafer of a recipe nobody specified (and no default specification) still gets its report, which says so.</summary>
public sealed class UnknownRecipeReportTests : IDisposable
{
    private readonly string _root = Directory.CreateTempSubdirectory("rw-unknown-recipe-").FullName;

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
    }

    [Fact]
    public async Task WriteAsync_RecipeWithoutSpecificationAndNoDefault_ReportWrittenWarnSayingUnspecified()
    {
        var storage = Options.Create(new StorageOptions { DataDirectory = _root });
        using var store = new SqliteRunWatchStore(storage, TimeProvider.System);
        await store.MigrateAsync(CancellationToken.None);
        var qc = Options.Create(new QcOptions { Recipes = { ["nw-known"] = new QcSpecification { MinWireCount = 10 } }, Default = null });
        var catalog = new QcSpecificationCatalog(store, qc, TimeProvider.System);
        var reports = new WaferReportService(store, store, Options.Create(new WaferPipelineOptions { PredictionFields = 1 }), qc, storage, TimeProvider.System,
            NullLogger<WaferReportService>.Instance, catalog);
        await StoredWafers.AddAsync(store, "W-UNSPEC-1", "nw-nobody-specified", StoredWafers.Linear(60, 20, 10, 1, seed: 4));

        WaferReportOutcome outcome = await reports.WriteAsync("W-UNSPEC-1", CancellationToken.None);

        Assert.Equal(QcOutcome.Warn, outcome.Verdict.Outcome);
        QcRuleResult rule = outcome.Verdict.Reasons.Single(r => r.Rule == "specification");
        Assert.Contains("unspecified specification", rule.Reason, StringComparison.Ordinal);
        string html = await File.ReadAllTextAsync(outcome.Files["html"]);
        Assert.Contains("No QC specification for recipe", html, StringComparison.Ordinal);
        Assert.Contains(await store.GetReportsAsync("W-UNSPEC-1", CancellationToken.None), r => r.Verdict == "warn");
    }
}
