using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Runs;
using RunWatch.Ingest.Tests.Support;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;

namespace RunWatch.Ingest.Tests.Runs;

public sealed class RunEvaluatorTests : IDisposable
{
    private static readonly DateTimeOffset T0 = Batches.T0;
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-eval-").FullName;
    private readonly SqliteRunWatchStore _store;

    public RunEvaluatorTests()
    {
        _store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
    }

    [Fact]
    public async Task EvaluateAsync_ConstantAtSetpoint_LEffEqualsLNomFromTheFormula()
    {
        var chamber = await SetUpAsync(t => 600.0);

        var run = await new RunEvaluator(_store).EvaluateAsync(Run(), chamber, CancellationToken.None);

        // DERIVED: L = sqrt(c·D0·exp(−Ea/(kB·T))·t) with T = 600 °C + 273.15 (ITS-90), kB = 8.617333262e-5 eV/K (CODATA 2018,
        // CONFIRMED in shared CHECKS.md), c = 1, t = 1000 s; D0 = 1e-2 cm²/s and Ea = 1.3 eV are the invented defaults.
        double expectedNm = Math.Sqrt(1e-2 * Math.Exp(-1.3 / (8.617333262e-5 * 873.15)) * 1000.0) * 1e7;
        Assert.NotNull(run.LNomNm);
        Assert.NotNull(run.LEffNm);
        Assert.Equal(expectedNm, run.LNomNm.Value, expectedNm * 1e-9);
        Assert.Equal(expectedNm, run.LEffNm.Value, expectedNm * 1e-6);
        Assert.Equal(600.0, run.TEffC!.Value, 1e-6);
        Assert.Equal(1.0, run.Coverage!.Value, 1e-9);
        Assert.NotNull(run.Excursions);
        Assert.Empty(run.Excursions);
    }

    [Fact]
    public async Task EvaluateAsync_HotExcursion_ReportedWithPositiveEffectOnL()
    {
        var chamber = await SetUpAsync(t => t is >= 400 and < 460 ? 620.0 : 600.0);

        var run = await new RunEvaluator(_store).EvaluateAsync(Run(), chamber, CancellationToken.None);

        Assert.True(run.LEffNm > run.LNomNm);
        var excursion = Assert.Single(run.Excursions!);
        Assert.Equal(RunWatch.Core.Excursions.ExcursionSeverity.Alarm, excursion.Severity);
        Assert.True(excursion.LengthChangeNm > 0);
        Assert.Equal(20.0, excursion.PeakDeviationK, 1e-9);
        // The change in L equals L_eff minus the length with the excursion at the setpoint, i.e. L_eff − L_nom here.
        Assert.Equal(run.LEffNm!.Value - run.LNomNm!.Value, excursion.LengthChangeNm!.Value, 1e-3);
    }

    [Fact]
    public async Task EvaluateAsync_ExcursionBeforeShutterOpens_ListedOutsideTheWindowWithNoEffectOnL()
    {
        // Hot from 400 to 460 s, growth shutter open from 500 s to the end: the growth window never sees the excursion.
        var chamber = await SetUpAsync(t => t is >= 400 and < 460 ? 620.0 : 600.0, shutterOpensAtS: 500);

        var run = await new RunEvaluator(_store).EvaluateAsync(Run(), chamber, CancellationToken.None);

        var excursion = Assert.Single(run.Excursions!);
        Assert.False(excursion.InGrowthWindow);
        Assert.Equal(0.0, excursion.LengthChangeNm);
        // DERIVED: L_eff over the 500 s window at 600 °C, same constants as the constant-setpoint test above.
        double expectedNm = Math.Sqrt(1e-2 * Math.Exp(-1.3 / (8.617333262e-5 * 873.15)) * 500.0) * 1e7;
        Assert.Equal(expectedNm, run.LEffNm!.Value, expectedNm * 1e-6);
    }

    [Fact]
    public void GrowthWindowFrom_ShutterOpensLateClosesEarly_WindowBetween()
    {
        var shutter = new[] { Sample(0, 0), Sample(100, 1), Sample(300, 0), Sample(350, 1), Sample(900, 0) };

        var window = RunEvaluator.GrowthWindowFrom(shutter, T0, 1000, 0.5);

        Assert.Equal(100, window.StartS);
        Assert.Equal(900, window.EndS);
        Assert.Equal(new RunWatch.Core.Thermal.GrowthWindow(0, 1000), RunEvaluator.GrowthWindowFrom([], T0, 1000, 0.5));
    }

    public void Dispose()
    {
        _store.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    private static SampleRecord Sample(double s, double v) => new(T0.AddSeconds(s), SampleRow.NoSeq, v);

    private static RunRecord Run() => new()
    {
        Chamber = "C1", Name = "R1", Status = RunStatus.Closed, StartedAt = T0, EndedAt = T0.AddSeconds(1000), SetpointC = 600, PlannedSeconds = 1000,
    };

    private async Task<ChamberRuntime> SetUpAsync(Func<double, double> temperatureAt, int? shutterOpensAtS = null)
    {
        await _store.MigrateAsync(CancellationToken.None);
        var options = TestChambers.Chamber();
        var registered = await _store.RegisterChambersAsync(ChamberRegistry.ToDefinitions([options]), CancellationToken.None);
        var chamber = new ChamberRegistry([options], registered).All[0];
        var batch = new IngestBatch();
        for (int i = 0; i <= 1000; i++)
        {
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.GrowthTemperature!.ChannelId, UnixMicros.From(T0.AddSeconds(i)), i, temperatureAt(i)));
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Setpoint!.ChannelId, UnixMicros.From(T0.AddSeconds(i)), i, 600));
            if (shutterOpensAtS is { } open)
            {
                batch.AddSample(new SampleRow(chamber.ChamberId, chamber.GrowthShutter!.ChannelId, UnixMicros.From(T0.AddSeconds(i)), i, i >= open ? 1 : 0));
            }
        }
        await _store.WriteBatchAsync(batch, CancellationToken.None);
        return chamber;
    }
}
