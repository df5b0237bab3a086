using System.Globalization;
using System.Text;
using System.Text.Json;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using RunWatch.Core.Excursions;
using RunWatch.Ingest.Chambers;
using RunWatch.Ingest.Configuration;
using RunWatch.Ingest.Runs;
using RunWatch.Storage;
using RunWatch.Storage.Sqlite;
using RunWatch.Tests.Commands;
using Xunit;

namespace RunWatch.Tests.Thermal;

/// <summary>
/// One invented thermal log through both entry points: the daemon's run-end evaluation (samples in the store,
/// growth window from the shutter channel) and <c>runwatch thermal</c> (the same samples as CSV, the same window
/// given as --from/--to). Every figure both report must agree.
/// </summary>
public sealed class ThermalEvaluationAgreementTests : IDisposable
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 4, 9, 0, 0, TimeSpan.Zero);
    private const double StepS = 0.5;
    private const double EndS = 2000;
    private const double ShutterOpenS = 400;
    private const double ShutterCloseS = 1600;
    private const double PlannedS = 1200;
    private const double D0 = 2.5e-3;
    private const double Ea = 1.2;
    private const double Convention = 4;
    private const double MaxGapS = 10;
    private readonly string _folder = Directory.CreateTempSubdirectory("runwatch-agree-").FullName;

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_folder, recursive: true);
    }

    /// <summary>
    /// An invented run on the instrument's scale: a lagging heat-up (a deviation alarm outside the growth window), a
    /// hold with seeded read noise, a hot bump inside the window, a setpoint step the heater follows with lag, a
    /// 30 s hole in the record, and a cold dip that straddles the shutter closing. The setpoint is logged on change.
    /// </summary>
    private static List<(double TimeS, double? Reading, double? Setpoint, double? Shutter)> InventedRun()
    {
        var random = new Random(2026);
        var rows = new List<(double, double?, double?, double?)>();
        double setpoint = double.NaN;
        for (int i = 0; i * StepS <= EndS; i++)
        {
            double t = i * StepS;
            if (t is > 1200 and < 1230)
            {
                continue;
            }
            double target = t < 1000 ? 600 : 610;
            double reading = t < 300 ? 200 + (400 * t / 300) : target - (t >= 1000 ? 10 * Math.Exp(-(t - 1000) / 20) : 0);
            reading += t is >= 800 and < 860 ? 16 : 0;
            reading -= t is >= 1580 and < 1640 ? 9 : 0;
            reading += 0.3 * Gaussian(random);
            double? logged = target != setpoint ? target : null;
            setpoint = target;
            double? shutter = t is ShutterOpenS or ShutterCloseS || i == 0 ? (t >= ShutterOpenS && t < ShutterCloseS ? 1 : 0) : null;
            rows.Add((t, Math.Round(reading, 3), logged, shutter));
        }
        return rows;
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    [Fact]
    public async Task OneLog_DaemonAndThermalCommand_AgreeOnEveryFigure()
    {
        var rows = InventedRun();

        // Daemon: the samples in the store, the run evaluated as at run end.
        using var store = new SqliteRunWatchStore(Options.Create(new StorageOptions { DataDirectory = _folder }), TimeProvider.System);
        await store.MigrateAsync(CancellationToken.None);
        var options = new ChamberOptions
        {
            Name = "C-AGREE",
            Site = "lab",
            Channels =
            [
                new ChannelOptions { Name = "substrate_tc", Role = ChannelRole.GrowthTemperature, Unit = "degC", Calibration = [new CalibrationPointOptions { Reading = 600, True = 604 }] },
                new ChannelOptions { Name = "substrate_sp", Role = ChannelRole.Setpoint, Unit = "degC", Calibration = [new CalibrationPointOptions { Reading = 600, True = 604 }] },
                new ChannelOptions { Name = "ga_shutter", Role = ChannelRole.GrowthShutter, Unit = "1" },
            ],
            Process = new ProcessOptions { D0CmSqPerS = D0, EaEv = Ea },
            DiffusionLength = { ConventionFactor = Convention, MaxGap = TimeSpan.FromSeconds(MaxGapS) },
            Excursions = { MaxGap = TimeSpan.FromSeconds(MaxGapS), StaleAfter = null },
        };
        var registered = await store.RegisterChambersAsync(ChamberRegistry.ToDefinitions([options]), CancellationToken.None);
        ChamberRuntime chamber = new ChamberRegistry([options], registered).All[0];
        var batch = new IngestBatch();
        long seq = 0;
        foreach (var (t, reading, setpoint, shutter) in rows)
        {
            long at = UnixMicros.From(T0.AddSeconds(t));
            batch.AddSample(new SampleRow(chamber.ChamberId, chamber.GrowthTemperature!.ChannelId, at, seq++, reading!.Value));
            if (setpoint is { } sp)
            {
                batch.AddSample(new SampleRow(chamber.ChamberId, chamber.Setpoint!.ChannelId, at, seq++, sp));
            }
            if (shutter is { } sh)
            {
                batch.AddSample(new SampleRow(chamber.ChamberId, chamber.GrowthShutter!.ChannelId, at, seq++, sh));
            }
        }
        await store.WriteBatchAsync(batch, CancellationToken.None);
        var run = new RunRecord { Chamber = "C-AGREE", Name = "R-AGREE", Status = RunStatus.Closed, StartedAt = T0, EndedAt = T0.AddSeconds(EndS), PlannedSeconds = PlannedS };
        RunRecord daemon = await new RunEvaluator(store).EvaluateAsync(run, chamber, CancellationToken.None);

        // Command: the same samples as a CSV log, the growth window as the shutter gave it.
        var csv = new StringBuilder("# invented agreement log\ntime,substrate_tc,substrate_sp,ga_shutter\n");
        foreach (var (t, reading, setpoint, shutter) in rows)
        {
            csv.Append(CultureInfo.InvariantCulture, $"{T0.AddSeconds(t):yyyy-MM-dd'T'HH:mm:ss.fffK},{reading},{setpoint},{shutter}\n");
        }
        using var log = new TempFile(csv.ToString());
        CommandRun command = CommandRun.Invoke("thermal", log.Path, "--json",
            "--from", Text(ShutterOpenS), "--to", Text(ShutterCloseS), "--setpoint-channel", "substrate_sp", "--setpoint-c", "610", "--planned-s", Text(PlannedS),
            "--d0", Text(D0), "--ea", Text(Ea), "--convention", Text(Convention), "--max-gap-s", Text(MaxGapS), "--calibrate", "600=604");
        Assert.True(command.ExitCode == 0, command.Error);
        using var doc = JsonDocument.Parse(command.Output);
        JsonElement json = doc.RootElement;

        RunThermalSummary summary = daemon.Summary!;
        Assert.Null(summary.Error);
        Assert.Equal(rows.Count, json.GetProperty("samples").GetInt32());
        Assert.Equal(summary.SampleCount, json.GetProperty("samples").GetInt32());
        Assert.Equal(summary.WindowStartS, json.GetProperty("window_start_s").GetDouble());
        Assert.Equal(summary.WindowEndS, json.GetProperty("window_end_s").GetDouble());
        Assert.Equal(summary.ConventionFactor, json.GetProperty("convention_factor").GetDouble());
        Assert.Equal(summary.IntegralCmSq, json.GetProperty("integral_d_dt_cm2").GetDouble());
        Assert.Equal(summary.CoveredS, json.GetProperty("covered_s").GetDouble());
        Assert.Equal(summary.GapCount, json.GetProperty("gaps").GetArrayLength());
        Assert.Equal(summary.IsComplete, json.GetProperty("complete").GetBoolean());
        Assert.Equal(summary.LogSensitivityPerK!.Value, json.GetProperty("dlnl_dt_per_k").GetDouble());
        Close(daemon.LNomNm!.Value / 1000, json.GetProperty("l_nom_um").GetDouble());
        Close(daemon.LEffNm!.Value / 1000, json.GetProperty("l_eff_um").GetDouble());
        Assert.Equal(daemon.TEffC!.Value, json.GetProperty("t_eff_c").GetDouble());
        Close(daemon.Coverage!.Value * 100, json.GetProperty("coverage_percent").GetDouble());

        var fromCommand = json.GetProperty("excursions").EnumerateArray().ToList();
        Assert.Equal(daemon.Excursions!.Count, fromCommand.Count);
        for (int i = 0; i < fromCommand.Count; i++)
        {
            RunExcursionRecord d = daemon.Excursions[i];
            JsonElement c = fromCommand[i];
            Close((d.Start - T0).TotalSeconds, c.GetProperty("start_s").GetDouble());
            Close((d.End - T0).TotalSeconds, c.GetProperty("end_s").GetDouble());
            Assert.Equal(d.DurationS, c.GetProperty("duration_s").GetDouble());
            Assert.Equal(d.PeakDeviationK, c.GetProperty("peak_deviation_k").GetDouble());
            Assert.Equal(d.Severity == ExcursionSeverity.Alarm ? "alarm" : "warning", c.GetProperty("severity").GetString());
            Assert.Equal(d.Closed, c.GetProperty("closed").GetBoolean());
            Assert.Equal(d.InGrowthWindow, c.GetProperty("in_growth_window").GetBoolean());
            Close(d.LengthChangeNm!.Value / 1000, c.GetProperty("delta_l_eff_um").GetDouble());
        }

        // The log exercises what the two paths once did differently: excursions outside the window (the heat-up),
        // inside it, and across its end; a gap; a plan.
        Assert.Contains(daemon.Excursions, e => !e.InGrowthWindow && e.LengthChangeNm == 0);
        Assert.Contains(daemon.Excursions, e => e.InGrowthWindow && e.LengthChangeNm > 0);
        Assert.Contains(daemon.Excursions, e => (e.Start - T0).TotalSeconds < ShutterCloseS && (e.End - T0).TotalSeconds > ShutterCloseS);
        Assert.False(summary.IsComplete);
        Assert.True(summary.HasPlan);
    }

    private static string Text(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    // Unit conversions (nm ↔ µm, fraction ↔ %, instants ↔ seconds) round in the last bits only.
    private static void Close(double expected, double actual) => Assert.Equal(expected, actual, Math.Abs(expected) * 1e-12 + 1e-9);
}
