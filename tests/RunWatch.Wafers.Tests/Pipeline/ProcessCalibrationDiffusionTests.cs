using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Wafers.Pipeline;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>The diffusion-model refit's plain reasons when no wafer can enter the fit (real SQLite; no solve is needed).</summary>
public sealed class ProcessCalibrationDiffusionTests : IDisposable
{
    private readonly string _root = Directory.CreateTempSubdirectory("rw-refit-diffusion-").FullName;
    private readonly SqliteRunWatchStore _store;

    public ProcessCalibrationDiffusionTests()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _root }), TimeProvider.System);
        _store.MigrateAsync(CancellationToken.None).GetAwaiter().GetResult();
    }

    public void Dispose()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_root, recursive: true);
    }

    [Fact]
    public async Task ProposeDiffusionModelAsync_WafersWithoutRuns_ListsEachWithWhyAndStoresNothing()
    {
        var wires = Enumerable.Range(0, 20).Select(i => new FieldWire(i, 400 + (i * 900), 3000, 40, true, true, null)).ToList();
        await StoredWafers.AddAsync(_store, "W-NORUN-1", "nw-norun", wires);
        await StoredWafers.AddAsync(_store, "W-NORUN-2", "nw-norun", wires);
        var service = new ProcessCalibrationService(_store, TimeProvider.System, _store, Options.Create(new WaferPipelineOptions()));

        DiffusionRefit refit = await service.ProposeDiffusionModelAsync("nw-norun", CancellationToken.None);

        Assert.False(refit.Proposed);
        Assert.Null(refit.Record);
        Assert.Equal(["W-NORUN-1: the wafer is linked to no run", "W-NORUN-2: the wafer is linked to no run"], refit.Skipped.Order(StringComparer.Ordinal));
        Assert.Contains("no wafer has analysed fields and a run with a thermal record", refit.Reason, StringComparison.Ordinal);
        Assert.Empty(await _store.GetModelFitsAsync("nw-norun", ModelKinds.Diffusion, 5, CancellationToken.None));
        Assert.Empty(await _store.GetModelFitsAsync("nw-norun", ModelKinds.DiffusionRefusal, 5, CancellationToken.None));
    }

    [Fact]
    public async Task RefitAsync_NothingFittable_MessageCarriesTheDiffusionReason()
    {
        var service = new ProcessCalibrationService(_store, TimeProvider.System, _store);

        var ex = await Assert.ThrowsAsync<InvalidOperationException>(() => service.RefitAsync("nw-none", CancellationToken.None));

        Assert.Contains("Nothing to refit", ex.Message, StringComparison.Ordinal);
        Assert.Contains("process nw-none has no stored wafer", ex.Message, StringComparison.Ordinal);
    }
}
