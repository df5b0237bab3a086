using MathNet.Numerics;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Core.Model;
using RunWatch.Core.Wafers;
using RunWatch.Wafers.Pipeline;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using Xunit;

namespace RunWatch.Wafers.Tests.Pipeline;

/// <summary>Refit of a process's models from wafers stored in a real SQLite file.</summary>
public sealed class ProcessCalibrationServiceTests : IDisposable
{
    private const double BoltzmannEvPerK = 8.617333262e-5;
    private readonly string _root = Directory.CreateTempSubdirectory("rw-refit-").FullName;
    private readonly SqliteRunWatchStore _store;

    public ProcessCalibrationServiceTests()
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
    public async Task RefitAsync_StoredWafers_ProposesFitsThatAgreeWithMathNet()
    {
        // Invented process: Ea 1.25 eV, D0 3e-4 cm²/s, L = sqrt(c·D·t) with c = 4, t = 1800 s, scattered by ±3 %.
        var random = new Random(7);
        double[] temperaturesK = [853.15, 868.15, 883.15, 898.15];
        var points = new List<ArrheniusPoint>();
        var allWires = new List<FieldWire>();
        for (int i = 0; i < temperaturesK.Length; i++)
        {
            double d = 3e-4 * Math.Exp(-1.25 / (BoltzmannEvPerK * temperaturesK[i]));
            double lNm = Math.Sqrt(4 * d * 1800) * 1e7 * (1 + (0.03 * ((2 * random.NextDouble()) - 1)));
            var point = new ArrheniusPoint(StoredWafers.Name("W-FIT", i), lNm, 1800, temperaturesK[i], 4);
            var wires = StoredWafers.Linear(80, 12, 30, 2, seed: 100 + i);
            points.Add(point);
            allWires.AddRange(wires);
            await StoredWafers.AddAsync(_store, point.WaferId, "nw-fit", wires, point);
        }
        await StoredWafers.AddAsync(_store, "W-OTHER", "nw-other", StoredWafers.Linear(50, 50, 0, 1, seed: 9));
        var service = new ProcessCalibrationService(_store, TimeProvider.System);

        ProcessRefit refit = await service.RefitAsync("nw-fit", CancellationToken.None);

        // Arrhenius: ln(L²/(c·t)) = ln D0 − Ea·(1/(kB·T)); MathNet.Numerics Fit.Line as the independent
        // least-squares reference (CONFIRMED: MathNet.Numerics 5.0 Fit.Line returns (intercept, slope)).
        double[] x = points.Select(p => 1 / (BoltzmannEvPerK * p.EffectiveTemperatureK)).ToArray();
        double[] y = points.Select(p => Math.Log(Math.Pow(p.CaptureRadiusNm * 1e-7, 2) / (p.ConventionFactor * p.GrowthDurationS))).ToArray();
        var (intercept, slope) = Fit.Line(x, y);
        Assert.NotNull(refit.Arrhenius);
        Assert.Equal(-slope, refit.Arrhenius.ActivationEnergy.Value, 1e-9);
        Assert.Equal(Math.Exp(intercept), refit.Arrhenius.Prefactor.Value, Math.Exp(intercept) * 1e-9);
        Assert.InRange(refit.Arrhenius.ActivationEnergy.Value, 1.0, 1.5); // near the invented 1.25 eV despite the scatter

        // Radius model: the counted wires (vertical and interior) of the process's wafers only, the other process left
        // out; linear least squares against MathNet.Numerics Fit.Line on the same wires (CONFIRMED, as above).
        var counted = allWires.Where(w => w.Vertical && w.Interior).ToList();
        var (a, b) = Fit.Line(counted.Select(w => w.ZoneNormalised!.Value).ToArray(), counted.Select(w => w.RadiusNm).ToArray());
        Assert.NotNull(refit.Radius);
        Assert.Equal(RadiusModelKind.Linear, refit.Radius.Kind);
        Assert.Equal(counted.Count, refit.Radius.Count);
        Assert.Equal(a, refit.Radius.Parameters[0].Value, 1e-9);
        Assert.Equal(b, refit.Radius.Parameters[1].Value, 1e-9);

        // Both stored as proposals, not accepted.
        var radius = await _store.GetModelFitsAsync("nw-fit", ModelKinds.Radius, 5, CancellationToken.None);
        var arrhenius = await _store.GetModelFitsAsync("nw-fit", ModelKinds.Arrhenius, 5, CancellationToken.None);
        Assert.Null(Assert.Single(radius).AcceptedAt);
        Assert.Null(Assert.Single(arrhenius).AcceptedAt);
        Assert.Equal(4, radius[0].Wafers.Count);
        var stored = ModelJson.Deserialize<RadiusModelFit>(radius[0].ParamsJson);
        Assert.Equal(refit.Radius.Parameters[0].Value, stored.Parameters[0].Value);
        Assert.Equal(refit.Radius.Parameters[1].Value, stored.Parameters[1].Value);
    }

    [Fact]
    public async Task RefitAsync_NoWafers_ThrowsWithReasonAndStoresNothing()
    {
        var service = new ProcessCalibrationService(_store, TimeProvider.System);

        var ex = await Assert.ThrowsAsync<InvalidOperationException>(() => service.RefitAsync("nw-empty", CancellationToken.None));

        Assert.Contains("Nothing to refit", ex.Message, StringComparison.Ordinal);
        Assert.Empty(await _store.GetModelFitsAsync("nw-empty", ModelKinds.Radius, 5, CancellationToken.None));
    }
}
