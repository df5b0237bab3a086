using Microsoft.Extensions.Options;
using RunWatch.Core.Qc;

namespace RunWatch.Storage.Tests;

public sealed class QcSpecificationCatalogTests
{
    private static QcOptions Config() => new()
    {
        Recipes = { ["nw-a"] = new QcSpecification { TargetMeanRadiusNm = 45, MeanRadiusToleranceNm = 10 } },
        Default = new QcSpecification { MinWireCount = 20 },
    };

    [Fact]
    public async Task SpecificationForAsync_FirstUse_SeedsFromConfigurationAndFallsBackToDefault()
    {
        using var db = new TempDatabase();
        await db.Store.MigrateAsync(CancellationToken.None);
        var catalog = new QcSpecificationCatalog(db.Store, Options.Create(Config()), TimeProvider.System);

        var own = await catalog.SpecificationForAsync("nw-a", CancellationToken.None);
        var other = await catalog.SpecificationForAsync("unlisted", CancellationToken.None);

        Assert.Equal(45, own.TargetMeanRadiusNm);
        Assert.Equal(20, other.MinWireCount);
        Assert.Equal(2, db.Count("SELECT COUNT(*) FROM qc_specifications"));
    }

    [Fact]
    public async Task UpdateAsync_InvalidSpecification_ThrowsWithReasonAndKeepsStoredValue()
    {
        using var db = new TempDatabase();
        await db.Store.MigrateAsync(CancellationToken.None);
        var catalog = new QcSpecificationCatalog(db.Store, Options.Create(Config()), TimeProvider.System);
        var invalid = new QcSpecification { TargetMeanRadiusNm = 45, MeanRadiusToleranceNm = 10, MeanRadiusWarnToleranceNm = 12 };

        var ex = await Assert.ThrowsAsync<ArgumentException>(() => catalog.UpdateAsync("nw-a", invalid, "ada-admin", "warn 12", null, CancellationToken.None));

        Assert.Contains("MeanRadiusWarnToleranceNm", ex.Message, StringComparison.Ordinal);
        Assert.Null((await catalog.SpecificationForAsync("nw-a", CancellationToken.None)).MeanRadiusWarnToleranceNm);
        Assert.Equal(0, db.Count("SELECT COUNT(*) FROM audit_entries WHERE action = 'spec edited'"));
    }

    [Fact]
    public async Task UpdateAsync_ValidSpecification_IsInForceForANewCatalogOnTheSameFile()
    {
        using var db = new TempDatabase();
        await db.Store.MigrateAsync(CancellationToken.None);
        var catalog = new QcSpecificationCatalog(db.Store, Options.Create(Config()), TimeProvider.System);
        await catalog.UpdateAsync("nw-a", new QcSpecification { TargetMeanRadiusNm = 30, MeanRadiusToleranceNm = 3 }, "ada-admin", "30 ± 3 nm", null, CancellationToken.None);

        var fresh = new QcSpecificationCatalog(db.Store, Options.Create(Config()), TimeProvider.System);
        var spec = await fresh.SpecificationForAsync("nw-a", CancellationToken.None);

        Assert.Equal(30, spec.TargetMeanRadiusNm);
        Assert.Equal(3, spec.MeanRadiusToleranceNm);
        Assert.Equal(1, db.Count("SELECT COUNT(*) FROM audit_entries WHERE action = 'spec edited' AND actor = 'ada-admin'"));
    }
}
