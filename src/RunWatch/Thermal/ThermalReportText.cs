using System.Globalization;
using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>Writes a <see cref="ThermalLogReport"/> for people: every length with its unit and convention factor.</summary>
internal static class ThermalReportText
{
    public static void Write(ThermalLogReport report, string fileName, TextWriter output)
    {
        DiffusionLengthResult r = report.Length;
        string c = $"(c = {F(r.ConventionFactor)}, L = sqrt(c·∫D dt))";
        output.WriteLine($"Thermal record {fileName}, channel {report.Channel}: {report.SampleCount} samples");
        output.WriteLine($"Window          {Time(r.Window.StartS, report.Origin)} to {Time(r.Window.EndS, report.Origin)} ({F(r.Window.DurationS)} s)");
        output.WriteLine($"Process         D0 = {G(r.Diffusivity.D0CmSqPerS)} cm²/s, Ea = {F(r.Diffusivity.EaEv)} eV");
        output.WriteLine($"Calibration     {Calibration(report.Settings.Calibration)}");
        if (r.NominalLengthUm is { } nominal && r.Plan is { } plan)
        {
            output.WriteLine($"L_nom           {nominal.ToString("0.0000", CultureInfo.InvariantCulture)} µm {c}  [{F(plan.SetpointC)} °C true for {F(plan.PlannedS)} s]");
        }
        output.WriteLine($"L_eff           {r.EffectiveLengthUm.ToString("0.0000", CultureInfo.InvariantCulture)} µm {c}{(r.IsComplete ? "" : "  INCOMPLETE: covers only the recorded part")}");
        output.WriteLine($"T_eff           {(double.IsNaN(r.EffectiveTemperatureC) ? "n/a" : r.EffectiveTemperatureC.ToString("0.00", CultureInfo.InvariantCulture) + " °C")} (true temperature giving the same ∫D dt over {F(r.CoveredS)} s)");
        output.WriteLine($"d(ln L)/dT      {(double.IsNaN(r.LogSensitivityPerK) ? "n/a" : r.LogSensitivityPerK.ToString("0.00000", CultureInfo.InvariantCulture) + " 1/K")} at T_eff ({(double.IsNaN(r.LogSensitivityPerK) ? "" : (100 * r.LogSensitivityPerK).ToString("0.000", CultureInfo.InvariantCulture) + " % of L per K")})");
        output.WriteLine($"Coverage        {r.CoveragePercent.ToString("0.00", CultureInfo.InvariantCulture)} % of the window ({F(r.CoveredS)} s recorded), gap limit {F(r.MaxGapS)} s: {(r.IsComplete ? "complete" : $"INCOMPLETE, {r.Gaps.Count} gap(s)")}");
        foreach (RecordGap gap in r.Gaps)
        {
            output.WriteLine($"  gap           {Time(gap.StartS, report.Origin)} to {Time(gap.EndS, report.Origin)} ({F(gap.DurationS)} s, not interpolated)");
        }

        ExcursionOptions e = report.Settings.Excursions;
        if (report.SetpointSource is null)
        {
            output.WriteLine("Excursions      not checked (no setpoint)");
        }
        else
        {
            int inside = report.Excursions.Count(x => x.InGrowthWindow);
            output.WriteLine($"Excursions      {report.Excursions.Count} beyond ±{F(e.WarningBandK)} K (alarm ±{F(e.AlarmBandK)} K) for ≥ {F(e.MinimumDuration.TotalSeconds)} s, setpoint {report.SetpointSource}; {inside} in the growth window");
            int n = 0;
            foreach (var (x, inWindow, changeUm) in report.Excursions)
            {
                n++;
                string deltaL = double.IsNaN(changeUm) ? "n/a" : changeUm.ToString("+0.0000;-0.0000;0.0000", CultureInfo.InvariantCulture) + $" µm (c = {F(r.ConventionFactor)})"
                    + (inWindow ? "" : ", outside the growth window");
                output.WriteLine(
                    $"  {n,3}. {Time(x.StartS, report.Origin)} to {Time(x.EndS, report.Origin)} ({F(x.DurationS)} s{(x.Closed ? "" : ", still open at the end")}), " +
                    $"{(x.Severity == ExcursionSeverity.Alarm ? "alarm" : "warning")}, peak {x.PeakDeviationK.ToString("+0.00;-0.00", CultureInfo.InvariantCulture)} K at {Time(x.PeakTimeS, report.Origin)}, ΔL_eff {deltaL}");
            }
        }
        foreach (AlarmTransition a in report.OtherAlarms)
        {
            output.WriteLine($"Alarm           {Describe(a.Kind)} at {Time(a.TimeS, report.Origin)} (reading {F(a.ValueC)} °C)");
        }
        if (report.OtherAlarms.Count > 0 || e.HighLimitC.HasValue || e.LowLimitC.HasValue)
        {
            output.WriteLine("Caution         these limit checks are a record of the run; they do not replace the heater's hardware interlocks or your site's safety procedures");
        }
        foreach (string note in report.Notes)
        {
            output.WriteLine($"Note            {note}");
        }
    }

    internal static string Describe(AlarmKind kind) => kind switch
    {
        AlarmKind.HighLimit => "high limit",
        AlarmKind.LowLimit => "low limit",
        AlarmKind.RateOfChange => "rate of change",
        AlarmKind.Stale => "stale record",
        AlarmKind.Flatline => "flatline (stuck sensor?)",
        AlarmKind.DeviationAlarm => "deviation alarm",
        _ => "deviation warning",
    };

    private static string Calibration(TemperatureCalibration calibration) =>
        calibration.IsIdentity
            ? "none (readings taken as true temperature)"
            : string.Join(", ", calibration.Points.Select(p => $"reading {F(p.ReadingC)} °C = true {F(p.TrueC)} °C"));

    private static string Time(double seconds, DateTimeOffset? origin) =>
        origin is { } o
            ? o.AddTicks((long)Math.Round(seconds * TimeSpan.TicksPerSecond)).ToString("yyyy-MM-dd'T'HH:mm:ss.FFFzzz", CultureInfo.InvariantCulture)
            : F(seconds) + " s";

    private static string F(double value) => value.ToString("0.###", CultureInfo.InvariantCulture);

    private static string G(double value) => value.ToString("G6", CultureInfo.InvariantCulture);
}
