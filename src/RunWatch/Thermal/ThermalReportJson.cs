using System.Text.Json;
using RunWatch.Core.Excursions;
using RunWatch.Core.Runs;
using RunWatch.Core.Thermal;

namespace RunWatch.Thermal;

/// <summary>Writes a <see cref="ThermalLogReport"/> as JSON (schema in docs/thermal.md). Undefined numbers are null.</summary>
internal static class ThermalReportJson
{
    public static void Write(ThermalLogReport report, string fileName, TextWriter output)
    {
        DiffusionLengthResult r = report.Length;
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            json.WriteStartObject();
            json.WriteString("file", fileName);
            json.WriteString("channel", report.Channel);
            json.WriteNumber("samples", report.SampleCount);
            if (report.Origin is { } origin)
            {
                json.WriteString("origin", origin);
            }
            json.WriteNumber("window_start_s", r.Window.StartS);
            json.WriteNumber("window_end_s", r.Window.EndS);
            json.WriteNumber("d0_cm2_per_s", r.Diffusivity.D0CmSqPerS);
            json.WriteNumber("ea_ev", r.Diffusivity.EaEv);
            json.WriteNumber("convention_factor", r.ConventionFactor);
            Number(json, "l_nom_um", r.NominalLengthUm ?? double.NaN);
            Number(json, "l_eff_um", r.EffectiveLengthUm);
            Number(json, "t_eff_c", r.EffectiveTemperatureC);
            Number(json, "dlnl_dt_per_k", r.LogSensitivityPerK);
            json.WriteNumber("integral_d_dt_cm2", r.IntegralCmSq);
            json.WriteNumber("covered_s", r.CoveredS);
            json.WriteNumber("coverage_percent", r.CoveragePercent);
            json.WriteNumber("max_gap_s", r.MaxGapS);
            json.WriteBoolean("complete", r.IsComplete);
            json.WriteStartArray("gaps");
            foreach (RecordGap gap in r.Gaps)
            {
                json.WriteStartObject();
                json.WriteNumber("start_s", gap.StartS);
                json.WriteNumber("end_s", gap.EndS);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteBoolean("excursions_checked", report.SetpointSource is not null);
            json.WriteStartArray("excursions");
            foreach (var (x, inWindow, changeUm) in report.Excursions)
            {
                json.WriteStartObject();
                json.WriteNumber("start_s", x.StartS);
                json.WriteNumber("end_s", x.EndS);
                json.WriteNumber("duration_s", x.DurationS);
                json.WriteNumber("peak_deviation_k", x.PeakDeviationK);
                json.WriteNumber("peak_time_s", x.PeakTimeS);
                json.WriteString("severity", x.Severity == ExcursionSeverity.Alarm ? "alarm" : "warning");
                json.WriteBoolean("closed", x.Closed);
                json.WriteBoolean("in_growth_window", inWindow);
                Number(json, "delta_l_eff_um", changeUm);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteStartArray("alarms");
            foreach (AlarmTransition a in report.OtherAlarms)
            {
                json.WriteStartObject();
                json.WriteString("kind", ThermalReportText.Describe(a.Kind));
                json.WriteNumber("time_s", a.TimeS);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteStartArray("notes");
            foreach (string note in report.Notes)
            {
                json.WriteStringValue(note);
            }
            json.WriteEndArray();
            json.WriteEndObject();
        }
        output.WriteLine(System.Text.Encoding.UTF8.GetString(stream.ToArray()));
    }

    private static void Number(Utf8JsonWriter json, string name, double value)
    {
        if (double.IsFinite(value))
        {
            json.WriteNumber(name, value);
        }
        else
        {
            json.WriteNull(name);
        }
    }
}
