using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using RunWatch.Wafers.Pipeline;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>The verdict uses the stored specification: an admin's edit changes the verdict of the next wafer evaluated, also after a restart.</summary>
public sealed class WaferReportServiceSpecTests : IDisposable
{
    private readonly string _root = Directory.CreateTempSubdirectory("rw-spec-").FullName;

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
    }

    /// <summary>60 counted wires, radii alternating 38 and 42 nm: mean exactly 40 nm.</summary>
    private static List<FieldWire> FortyNanometreWires() =>
        [.. Enumerable.Range(0, 60).Select(i => new FieldWire(i, 500 + (i % 10 * 1500), 500 + (i / 10 * 1500), i % 2 == 0 ? 38 : 42, true, true, 0.5 + (i * 0.02)))];

    private (SqliteRunWatchStore Store, QcSpecificationCatalog Catalog, WaferReportService Reports) Open()
    {
        var storage = Options.Create(new StorageOptions { DataDirectory = _root });
        var store = new SqliteRunWatchStore(storage, TimeProvider.System);
        store.MigrateAsync(CancellationToken.None).GetAwaiter().GetResult();
        // Configuration's default for the recipe: 45 ± 10 nm and at least 50 wires.
        var qc = Options.Create(new QcOptions { Recipes = { ["nw-spec"] = new QcSpecification { TargetMeanRadiusNm = 45, MeanRadiusToleranceNm = 10, MinWireCount = 50 } } });
        var catalog = new QcSpecificationCatalog(store, qc, TimeProvider.System);
        var reports = new WaferReportService(store, store, Options.Create(new WaferPipelineOptions { PredictionFields = 1 }), qc, storage, TimeProvider.System,
            NullLogger<WaferReportService>.Instance, catalog);
        return (store, catalog, reports);
    }

    [Fact]
    public async Task WriteAsync_AfterAdminEditsSpec_NextWaferJudgedByEditedSpec()
    {
        var (store, catalog, reports) = Open();
        await StoredWafers.AddAsync(store, "W-SPEC-1", "nw-spec", FortyNanometreWires());
        await StoredWafers.AddAsync(store, "W-SPEC-2", "nw-spec", FortyNanometreWires());
        await StoredWafers.AddAsync(store, "W-SPEC-3", "nw-spec", FortyNanometreWires());

        // Hand computation (DERIVED): mean 40 nm, |40 − 45| = 5 ≤ 10 → pass; 60 ≥ 50 wires → pass.
        WaferReportOutcome before = await reports.WriteAsync("W-SPEC-1", CancellationToken.None);
        await catalog.UpdateAsync("nw-spec", new QcSpecification { TargetMeanRadiusNm = 30, MeanRadiusToleranceNm = 5, MinWireCount = 50 },
            "ada-admin", "mean radius 35…55 → 25…35 nm", null, CancellationToken.None);
        // Edited: |40 − 30| = 10 > 5 → fail.
        WaferReportOutcome after = await reports.WriteAsync("W-SPEC-2", CancellationToken.None);

        // Restart: a new store and catalog on the same file still judge by the edited spec.
        store.Dispose();
        SqliteConnection.ClearAllPools();
        var (reopened, _, reportsAfterRestart) = Open();
        WaferReportOutcome afterRestart = await reportsAfterRestart.WriteAsync("W-SPEC-3", CancellationToken.None);
        var audit = await reopened.GetAuditAsync(10, CancellationToken.None);
        reopened.Dispose();

        // Before the edit every specified rule passes; the verdict is WARN only because the process has no accepted
        // diffusion radius model (the default model), which the verdict says.
        Assert.Equal(QcOutcome.Pass, before.Verdict.Rules.Single(r => r.Rule == "mean-radius").Outcome);
        Assert.Equal(QcOutcome.Pass, before.Verdict.Rules.Single(r => r.Rule == "wire-count").Outcome);
        Assert.Equal(WaferEvaluator.RadiusModelRule, Assert.Single(before.Verdict.Reasons).Rule);
        Assert.Equal(QcOutcome.Fail, after.Verdict.Outcome);
        QcRuleResult meanRule = after.Verdict.Rules.Single(r => r.Rule == "mean-radius");
        Assert.Equal(QcOutcome.Fail, meanRule.Outcome);
        Assert.Equal(40, meanRule.Measured!.Value, 1e-9);
        Assert.Equal(QcOutcome.Fail, afterRestart.Verdict.Outcome);
        var edit = audit.Single(a => a.Action == "spec edited");
        Assert.Equal("ada-admin", edit.Actor);
        Assert.Equal("mean radius 35…55 → 25…35 nm", AuditDetail.Text(edit.DetailJson));
    }
}
