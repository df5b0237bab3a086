using System.Globalization;
using System.Text;
using System.Text.Json;
using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Tests.Commands;

public sealed class ThermalCommandTests
{
    // COMMON PRACTICE, no source: 5 minutes at 500 °C ↔ L ≈ 3 µm (c = 1), i.e. D(500 °C) = 3e-10 cm²/s; Ea = 1 eV chosen here.
    private static readonly ArrheniusDiffusivity Process = ArrheniusDiffusivity.FromReference(3e-10, 773.15, 1.0);

    private static string D0 => Process.D0CmSqPerS.ToString("R", CultureInfo.InvariantCulture);

    private static string ConstantLog(double celsius, double seconds, double step, bool iso = false)
    {
        var text = new StringBuilder("# invented test log\ntime,substrate_tc,substrate_sp\n");
        var origin = new DateTimeOffset(2026, 3, 4, 10, 0, 0, TimeSpan.Zero);
        for (double t = 0; t <= seconds + 1e-9; t += step)
        {
            string stamp = iso ? origin.AddSeconds(t).ToString("yyyy-MM-dd'T'HH:mm:ss.fffK", CultureInfo.InvariantCulture) : t.ToString("0.###", CultureInfo.InvariantCulture);
            text.Append(CultureInfo.InvariantCulture, $"{stamp},{celsius},{celsius}\n");
        }
        return text.ToString();
    }

    [Fact]
    public void Thermal_FiveMinutesAt500C_PrintsThreeMicrometresWithConventionFactor()
    {
        using var log = new TempFile(ConstantLog(500, 300, 0.5));
        CommandRun run = CommandRun.Invoke("thermal", log.Path, "--setpoint-c", "500", "--planned-s", "300", "--d0", D0, "--ea", "1");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("L_nom           3.0000 µm (c = 1", run.Output);
        Assert.Contains("L_eff           3.0000 µm (c = 1", run.Output);
        Assert.Contains("T_eff           500.00 °C", run.Output);
        Assert.Contains("Coverage        100.00 %", run.Output);
        Assert.Contains("Excursions      0 beyond", run.Output);
        Assert.Equal("", run.Error);
    }

    [Fact]
    public void Thermal_Json_CarriesFiguresAndExcursion()
    {
        var text = new StringBuilder("time,substrate_tc\n");
        for (int i = 0; i <= 1200; i++)
        {
            double value = i is >= 400 and < 460 ? 626 : 610; // one 60 s step excursion of +16 K
            text.Append(CultureInfo.InvariantCulture, $"{i},{value}\n");
        }
        using var log = new TempFile(text.ToString());
        CommandRun run = CommandRun.Invoke("thermal", log.Path, "--setpoint-c", "610", "--d0", D0, "--ea", "1", "--convention", "4", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Output);
        JsonElement root = doc.RootElement;
        Assert.Equal(4, root.GetProperty("convention_factor").GetDouble());
        Assert.True(root.GetProperty("complete").GetBoolean());
        JsonElement excursion = Assert.Single(root.GetProperty("excursions").EnumerateArray().ToList());
        Assert.Equal(400, excursion.GetProperty("start_s").GetDouble());
        Assert.Equal(460, excursion.GetProperty("end_s").GetDouble());
        Assert.Equal(16, excursion.GetProperty("peak_deviation_k").GetDouble(), 1e-9);
        Assert.Equal("alarm", excursion.GetProperty("severity").GetString());
        Assert.True(excursion.GetProperty("delta_l_eff_um").GetDouble() > 0);

        // L_eff from the JSON against a recomputation with the integrator on the same samples.
        double[] t = Enumerable.Range(0, 1201).Select(i => (double)i).ToArray();
        double[] r = t.Select(x => x is >= 400 and < 460 ? 626.0 : 610.0).ToArray();
        double integral = ThermalIntegrator.Integrate(t, r, TemperatureCalibration.Identity, Process, 0, 1200, 10).IntegralCmSq;
        Assert.Equal(DiffusionLength.LengthUm(integral, 4), root.GetProperty("l_eff_um").GetDouble(), 1e-9);
    }

    [Fact]
    public void Thermal_IsoTimesWithWindowAndCalibration_UsesTrueTemperature()
    {
        // CONFIRMED (CHECKS §9): oxide desorption ≈ 580 °C; seen at a reading of 560 °C → +20 K over the log.
        using var log = new TempFile(ConstantLog(480, 600, 1, iso: true));
        CommandRun run = CommandRun.Invoke(
            "thermal", log.Path, "--from", "2026-03-04T10:01:00Z", "--to", "2026-03-04T10:06:00+00:00",
            "--calibrate", "560=580", "--d0", D0, "--ea", "1", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Output);
        Assert.Equal(500, doc.RootElement.GetProperty("t_eff_c").GetDouble(), 1e-9);
        Assert.Equal(300, doc.RootElement.GetProperty("covered_s").GetDouble(), 1e-9);
        Assert.Equal(3.0, doc.RootElement.GetProperty("l_eff_um").GetDouble(), 1e-9);
    }

    [Fact]
    public void Thermal_GapInLog_ReportsIncomplete()
    {
        string text = "time,tc\n0,600\n1,600\n2,600\n60,600\n61,600\n";
        using var log = new TempFile(text);
        CommandRun run = CommandRun.Invoke("thermal", log.Path, "--max-gap-s", "10");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("INCOMPLETE, 1 gap(s)", run.Output);
        Assert.Contains("gap           2 s to 60 s (58 s, not interpolated)", run.Output);
        Assert.Contains("built-in example process (invented", run.Output);
    }

    [Fact]
    public void Thermal_SimulatedDemoRun_FindsTheInjectedExcursionInTheGrowthWindow()
    {
        // End to end: the invented demo chamber → CSV → runwatch thermal over the growth step.
        var simulator = new RunWatch.Simulation.Chamber.ChamberSimulator(new RunWatch.Simulation.Chamber.ChamberSimulatorOptions());
        var growth = simulator.Schedule().Single(s => s.Step.Name == "growth");
        var writer = new StringWriter();
        RunWatch.Simulation.Chamber.ChamberCsvWriter.Write(simulator.Run(), new DateTimeOffset(2026, 3, 4, 9, 0, 0, TimeSpan.Zero), writer);
        using var log = new TempFile(writer.ToString());
        CommandRun run = CommandRun.Invoke(
            "thermal", log.Path, "--from", growth.StartS.ToString("R", CultureInfo.InvariantCulture), "--to", growth.EndS.ToString("R", CultureInfo.InvariantCulture),
            "--setpoint-channel", "substrate_sp", "--setpoint-c", "610", "--planned-s", "1800", "--d0", D0, "--ea", "1", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Output);
        JsonElement root = doc.RootElement;
        // The whole log is the run: the heat-up and cool-down lag the setpoint outside the growth window and change nothing.
        var excursions = root.GetProperty("excursions").EnumerateArray().ToList();
        JsonElement excursion = Assert.Single(excursions, e => e.GetProperty("in_growth_window").GetBoolean());
        Assert.Equal("alarm", excursion.GetProperty("severity").GetString());
        Assert.True(excursion.GetProperty("delta_l_eff_um").GetDouble() > 0);
        Assert.All(excursions.Where(e => !e.GetProperty("in_growth_window").GetBoolean()), e => Assert.Equal(0, e.GetProperty("delta_l_eff_um").GetDouble()));
        Assert.True(root.GetProperty("l_eff_um").GetDouble() > root.GetProperty("l_nom_um").GetDouble(), "an over-temperature excursion lengthens L");
        Assert.True(root.GetProperty("complete").GetBoolean());
    }

    [Fact]
    public void Thermal_HighLimit_ReportsAlarmWithCaution()
    {
        using var log = new TempFile("time,tc\n0,600\n1,655\n2,655\n3,600\n");
        CommandRun run = CommandRun.Invoke("thermal", log.Path, "--high-c", "650");
        Assert.Equal(0, run.ExitCode);
        Assert.Contains("Alarm           high limit at 1 s (reading 655 °C)", run.Output);
        Assert.Contains("do not replace the heater's hardware interlocks", run.Output);
    }

    [Theory]
    [InlineData("time,tc\n0,600\n1,6o0\n", "line 3, column 2 (tc): '6o0' is not a number")]
    [InlineData("time,tc\n0,600\n1,600,1\n", "line 3: 3 cells, but the header has 2 columns")]
    [InlineData("# c\ntime,tc\n0,600\n5,600\n4,600\n", "line 5, column 1 (time): time goes backwards")]
    [InlineData("time,tc\n2026-03-04T10:00:00,600\n", "line 2, column 1 (time): '2026-03-04T10:00:00' is neither seconds nor an ISO-8601 time with an offset")]
    [InlineData("time,tc\n", "no data rows")]
    [InlineData("time\n0\n", "line 1: the header needs a timestamp column")]
    public void Thermal_MalformedLog_NamesLineAndColumnAndFails(string contents, string expected)
    {
        using var log = new TempFile(contents);
        CommandRun run = CommandRun.Invoke("thermal", log.Path);
        Assert.Equal(1, run.ExitCode);
        Assert.Contains(expected, run.Error);
        Assert.Equal("", run.Output);
    }

    [Theory]
    [InlineData("--d0", "1e-3")]
    [InlineData("--channel", "nope")]
    [InlineData("--calibrate", "560:580")]
    [InlineData("--convention", "0")]
    public void Thermal_BadOption_FailsWithMessage(string option, string value)
    {
        using var log = new TempFile("time,tc\n0,600\n1,600\n");
        CommandRun run = CommandRun.Invoke("thermal", log.Path, option, value);
        Assert.Equal(1, run.ExitCode);
        Assert.StartsWith("runwatch thermal:", run.Error);
    }

    [Fact]
    public void Thermal_MissingFile_FailsWithMessage()
    {
        CommandRun run = CommandRun.Invoke("thermal", Path.Combine(Path.GetTempPath(), $"missing-{Guid.NewGuid():N}.csv"));
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("missing-", run.Error);
    }
}
