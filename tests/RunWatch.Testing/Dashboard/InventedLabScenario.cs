using System.Globalization;
using System.Text;
using RunWatch.Core.Safety;
using RunWatch.Web.Data;

namespace RunWatch.Testing.Dashboard;

/// <summary>
/// An invented lab for tests, screenshots and benchmarks: two chambers, runs, one wafer with fields, alerts and a
/// process model. All names and numbers are made up for illustration; they describe no real lab or person.
/// </summary>
public static class InventedLabScenario
{
    // The invented process's diffusivity (Core's Arrhenius law): D0 = 2.5e-5 cm²/s, Ea = 1.3 eV, the planner's defaults.
    private static readonly RunWatch.Core.Thermal.ArrheniusDiffusivity Scenario = new(2.5e-5, 1.3);

    public const string GrowingChamber = "north-1";
    public const string IdleChamber = "south-2";
    public const string ActiveRun = "R-2031";
    public const string EndedRun = "R-2030";
    public const string Wafer = "W-2030-A";
    public const string Process = "gaas-selfcat-std";
    public const string OpenAlert = "A-0107";
    public const string TemperatureChannel = "substrate_tc";
    public const string SetpointChannel = "substrate_sp";

    /// <summary>Seeds the data source; the ended run lasts <paramref name="endedRunHours"/> at <paramref name="sampleRateHz"/>.</summary>
    public static void Seed(InMemoryDashboardData data, DateTimeOffset now, double sampleRateHz = 1, double endedRunHours = 1.5)
    {
        ArgumentNullException.ThrowIfNull(data);
        var bands = new TemperatureBands(3, 8);
        // Both invented chambers map three reminder roles; hydride flow, bake-out and the electron gun have no channel
        // here, so their reminders show as "not watched on this chamber".
        var roles = new Dictionary<ReminderChannelRole, string>
        {
            [ReminderChannelRole.GrowthTemperature] = TemperatureChannel,
            [ReminderChannelRole.ArsenicSourceTemperature] = "as_cell_tc",
            [ReminderChannelRole.CryopanelFill] = "ln2_fill",
        };
        string[] channels = [TemperatureChannel, SetpointChannel, "as_cell_tc", "ga_shutter", "ln2_fill"];
        data.AddChamber(new ChamberStatus(GrowingChamber, "invented lab", null, null, TemperatureChannel, SetpointChannel, "°C", null, null, null, 0,
            new Dictionary<string, double>(), bands, ConfiguredRoles: roles, Channels: channels));
        data.AddChamber(new ChamberStatus(IdleChamber, "invented lab", null, null, TemperatureChannel, SetpointChannel, "°C", null, null, null, 0,
            new Dictionary<string, double>(), bands, ConfiguredRoles: roles, Channels: channels));

        // Ended run: ramp up, growth at 610 °C with one excursion, cool-down; it ends 40 min before now.
        var endedEnd = now.AddMinutes(-40);
        var endedStart = endedEnd.AddHours(-endedRunHours);
        double span = (endedEnd - endedStart).TotalSeconds;
        var growthStart = endedStart.AddSeconds(span * 0.2);
        var growthEnd = endedStart.AddSeconds(span * 0.8);
        var excursionStart = endedStart.AddSeconds(span * 0.5);
        var excursionEnd = excursionStart.AddMinutes(3);
        AppendProfile(data, IdleChamber, endedStart, endedEnd, sampleRateHz, t =>
        {
            double f = (t - endedStart).TotalSeconds / span;
            double baseline = f < 0.2 ? 200 + (410 * f / 0.2) : f < 0.8 ? 610 : 610 - (480 * (f - 0.8) / 0.2);
            double bump = t >= excursionStart && t <= excursionEnd ? 9 * Math.Sin(Math.PI * (t - excursionStart).TotalSeconds / 180) : 0;
            return baseline + bump + (0.25 * Math.Sin(f * 900));
        });
        // South-2 then cools slowly and stops reporting 45 s before now (telemetry stale).
        AppendProfile(data, IdleChamber, endedEnd.AddSeconds(1), now.AddSeconds(-45), 0.2, t => 130 - ((t - endedEnd).TotalMinutes * 0.5), setpoint: 25);
        data.AddSamples(IdleChamber, "as_cell_tc", now.AddSeconds(-45), 95);

        // Active run on north-1: started 25 min ago, growth window of 30 min from 20 min ago.
        var activeStart = now.AddMinutes(-25);
        AppendProfile(data, GrowingChamber, now.AddMinutes(-35), now.AddSeconds(-1), 1, t => t < activeStart.AddMinutes(5)
            ? 450 + (160 * Math.Clamp((t - activeStart).TotalMinutes / 5, 0, 1))
            : 610 + (0.8 * Math.Sin((t - activeStart).TotalSeconds / 40)));
        data.AddSamples(GrowingChamber, "as_cell_tc", now.AddSeconds(-1), 342);
        data.AddSamples(GrowingChamber, "ga_shutter", now.AddSeconds(-1), 1);
        data.AddSamples(GrowingChamber, "ln2_fill", now.AddSeconds(-1), 0);

        data.AddRun(new RunDetail(
            new RunSummary(EndedRun, IdleChamber, "nw-gaas-std", endedStart, endedEnd, 610, growthEnd - growthStart,
                new GrowthWindow(growthStart, growthEnd), [Wafer], 1, "review", LEffNm: 418.6),
            new ThermalResult(LNomNm: 412.0, LEffNm: 418.6, TEffC: 611.1, ConventionFactor: 1, CoveragePercent: 99.8, D0CmSquaredPerSecond: 2.5e-5, ActivationEnergyEv: 1.3),
            [new ExcursionView(excursionStart, excursionEnd, 9.0, AlertSeverity.Alarm, 1.1)],
            new RadiusPrediction(38.5, 6.2, 28.3, 48.7), TemperatureChannel));
        data.AddRun(new RunDetail(
            new RunSummary(ActiveRun, GrowingChamber, "nw-gaas-std", activeStart, null, 610, TimeSpan.FromMinutes(30),
                new GrowthWindow(now.AddMinutes(-20), now.AddMinutes(10)), ["W-2031-A", "W-2031-B"], 0, null),
            null, [], new RadiusPrediction(37.9, 6.0, 28.0, 47.8), TemperatureChannel));
        data.AddRun(new RunDetail(
            new RunSummary("R-2029", IdleChamber, "nw-gaas-thin", now.AddDays(-1).AddHours(-2), now.AddDays(-1), 590, TimeSpan.FromMinutes(45),
                new GrowthWindow(now.AddDays(-1).AddHours(-1.5), now.AddDays(-1).AddHours(-0.75)), ["W-2029-A"], 0, "pass", LEffNm: 299.1),
            new ThermalResult(300.2, 299.1, 589.7, 1, 100, 2.5e-5, 1.3), [], new RadiusPrediction(28.0, 4.1, 21.3, 34.7), TemperatureChannel));

        SeedWafer(data, now);
        data.AddAlert(new AlertView(OpenAlert, IdleChamber, EndedRun, "Substrate 9.0 K above setpoint for 3 min (alarm band ±8 K)", AlertSeverity.Alarm,
            AlertState.ActiveUnacknowledged, excursionStart, null, null, null, null, null));
        data.AddAlert(new AlertView("A-0106", GrowingChamber, ActiveRun, "Arsenic cell 4 K below its setpoint", AlertSeverity.Warning,
            AlertState.ActiveAcknowledged, now.AddMinutes(-15), null, "demo-engineer", "cell re-tuned, watching", null, null));
        data.AddAlert(new AlertView("A-0105", GrowingChamber, "R-2029", "Telemetry gap of 12 s", AlertSeverity.Warning,
            AlertState.Normal, now.AddDays(-1).AddHours(-1), now.AddDays(-1).AddHours(-1).AddSeconds(12), "demo-engineer", "gateway restart", null, null));
        // The heating ramp of the active run: a deviation recorded while suppressed by design, never raised.
        data.AddAlert(new AlertView("A-0108", GrowingChamber, ActiveRun, "Deviation beyond the alarm band (412.0 °C, setpoint 610.0 °C)", AlertSeverity.Alarm,
            AlertState.Normal, now.AddMinutes(-25), now.AddMinutes(-21), null, null, null, null, WasSuppressed: true));
        data.AddSpec(new SpecEntry("mean radius", 30, 45, "nm"));
        data.AddSpec(new SpecEntry("radius CV", null, 0.2, "fraction", Sides: SpecSides.Upper));
        data.AddSpec(new SpecEntry("density", 0.5, 3, "µm⁻²"));
    }

    private static void SeedWafer(InMemoryDashboardData data, DateTimeOffset now)
    {
        var random = new Random(2030);
        var wires = new List<WireMeasurement>();
        var points = new List<ModelPoint>();
        for (int i = 0; i < 240; i++)
        {
            double area = 0.25 + (random.NextDouble() * 0.9);
            double predicted = 20 + (22 * area);
            double measured = predicted + ((random.NextDouble() - 0.5) * 7);
            wires.Add(new WireMeasurement(measured, area, predicted));
            points.Add(new ModelPoint(area, measured, Wafer));
        }
        var fields = new List<FieldView>();
        for (int f = 1; f <= 2; f++)
        {
            string id = $"F-2030-A-{f:D2}";
            fields.Add(new FieldView(id, $"w2030a_{f:D2}.tif", now.AddMinutes(-30 + f), 2.5, 120));
            data.AddFieldImage(id, false, FieldSvg(f, false));
            data.AddFieldImage(id, true, FieldSvg(f, true));
        }
        data.AddWafer(new WaferDetail(Wafer, EndedRun, fields, new WaferStatistics(240, 1.42, 38.9, 6.8, 1.18, 0.71), wires,
            new VerdictView(VerdictOutcome.Review, ["an alarm excursion of 9.0 K lasted 3 min during growth (effect on L_eff +1.1 %)", "mean radius 38.9 nm within spec 30–45 nm", "radius CV 0.17 within spec ≤ 0.2"], now.AddMinutes(-10),
                [
                    new VerdictRuleView("mean radius", 38.9, "30–45", "33–42", "nm", VerdictOutcome.Pass, "38.9 nm within 30–45 nm"),
                    new VerdictRuleView("radius CV", 0.17, "≤ 0.2", "≤ 0.18", "fraction", VerdictOutcome.Pass, "0.17 within ≤ 0.2"),
                    new VerdictRuleView("excursions in growth window", 1, "≤ 2", "≤ 0", "count", VerdictOutcome.Review, "one alarm excursion of 9.0 K during growth"),
                    new VerdictRuleView("|prediction bias|", null, "≤ 4", "≤ 2", "nm", VerdictOutcome.Review, "not measured: no accepted radius model for this process yet"),
                ],
                new PredictionAgreement(240, 0.8, 3.1, 0.71, 2.4)),
            ["html", "csv", "json"]));
        string csv = "wire,radius_nm,capture_area_norm,predicted_nm\n" + string.Join('\n', wires.Select((w, i) =>
            string.Create(CultureInfo.InvariantCulture, $"{i + 1},{w.RadiusNm:F2},{w.NormalisedCaptureArea:F4},{w.PredictedRadiusNm:F2}"))) + "\n";
        data.AddReport(Wafer, "csv", new ReportFile(Wafer + ".csv", "text/csv", Encoding.UTF8.GetBytes(csv)));
        data.AddReport(Wafer, "html", new ReportFile(Wafer + ".html", "text/html",
            Encoding.UTF8.GetBytes($"<!DOCTYPE html><html><body><h1>Wafer {Wafer} (invented demo data)</h1><p>Verdict: review</p></body></html>")));
        data.AddReport(Wafer, "json", new ReportFile(Wafer + ".json", "application/json",
            Encoding.UTF8.GetBytes($"{{\"wafer\":\"{Wafer}\",\"verdict\":\"review\",\"wires\":240}}")));
        data.AddUnmatchedField(new UnmatchedField("F-UNM-0007", "sem_0007.tif", now.AddMinutes(-5), "file name carries no wafer id"));
        data.AddProcessModel(new ProcessModelView(Process,
            new RadiusFit(RadiusModelForm.Linear, 20.4, 21.6, 0.81, 2.1, 240, now.AddDays(-7)), null,
            new ArrheniusFit(2.5e-5, 1.3, 0.97), points,
            [.. new[] { 560.0, 580, 600, 620, 640 }.Select(c => new ArrheniusPoint(RunWatch.Core.Thermal.PhysicalConstants.CelsiusToKelvin(c),
                Scenario.DiffusivityCmSqPerS(RunWatch.Core.Thermal.PhysicalConstants.CelsiusToKelvin(c)) * (0.9 + (random.NextDouble() * 0.2))))],
            "demo-admin", now.AddDays(-7)));
    }

    private static ReportFile FieldSvg(int seed, bool overlay)
    {
        var random = new Random(seed);
        var sb = new StringBuilder("<svg xmlns='http://www.w3.org/2000/svg' viewBox='0 0 320 320' width='320' height='320'><rect width='320' height='320' fill='#1b1b1b'/>");
        for (int i = 0; i < 120; i++)
        {
            double x = random.NextDouble() * 320;
            double y = random.NextDouble() * 320;
            double r = 4 + (random.NextDouble() * 3);
            sb.Append(CultureInfo.InvariantCulture, $"<polygon points='{Hex(x, y, r)}' fill='#d8d8d8'/>");
            if (overlay)
            {
                sb.Append(CultureInfo.InvariantCulture, $"<circle cx='{x:F1}' cy='{y:F1}' r='{r + 2:F1}' fill='none' stroke='#ffb000' stroke-width='1'/>");
            }
        }
        if (overlay)
        {
            sb.Append("<rect x='16' y='16' width='288' height='288' fill='none' stroke='#4fc3f7' stroke-dasharray='6 4'/>");
        }
        sb.Append("</svg>");
        return new ReportFile($"field-{seed}.svg", "image/svg+xml", Encoding.UTF8.GetBytes(sb.ToString()));
    }

    private static string Hex(double x, double y, double r) => string.Join(' ', Enumerable.Range(0, 6).Select(k =>
        string.Create(CultureInfo.InvariantCulture, $"{x + (r * Math.Cos(k * Math.PI / 3)):F1},{y + (r * Math.Sin(k * Math.PI / 3)):F1}")));

    private static void AppendProfile(InMemoryDashboardData data, string chamber, DateTimeOffset from, DateTimeOffset to, double rateHz,
        Func<DateTimeOffset, double> temperature, double setpoint = 610)
    {
        int n = (int)((to - from).TotalSeconds * rateHz) + 1;
        var t = new double[n];
        var v = new double[n];
        var sp = new double[n];
        double start = from.ToUnixTimeMilliseconds() / 1000.0;
        for (int i = 0; i < n; i++)
        {
            t[i] = start + (i / rateHz);
            v[i] = temperature(from.AddSeconds(i / rateHz));
            sp[i] = setpoint;
        }
        data.AppendSamples(chamber, TemperatureChannel, t, v);
        data.AppendSamples(chamber, SetpointChannel, t, sp);
    }
}
