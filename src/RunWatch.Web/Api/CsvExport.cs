using System.Globalization;
using CsvHelper;
using RunWatch.Web.Data;

namespace RunWatch.Web.Api;

/// <summary>
/// The runs, wafers and alerts tables as CSV (RFC 4180 through CsvHelper; text cells that a spreadsheet would read as a
/// formula are escaped, OWASP "CSV Injection", COMMON PRACTICE). Times are ISO 8601 UTC, numbers invariant.
/// </summary>
public static class CsvExport
{
    private static readonly CsvWriterOptions Options = new() { Injection = CsvInjection.Escape, FormatProvider = CultureInfo.InvariantCulture };

    /// <summary>One row per run: the runs table's columns.</summary>
    public static string Runs(IReadOnlyList<RunSummary> runs)
    {
        ArgumentNullException.ThrowIfNull(runs);
        return Write(["run", "chamber", "recipe", "start_utc", "end_utc", "setpoint_c", "excursions_counted", "l_eff_nm", "verdict", "wafers"], runs, (csv, r) =>
        {
            csv.WriteField(r.RunId);
            csv.WriteField(r.Chamber);
            csv.WriteField(r.Recipe);
            csv.WriteField(Utc(r.Start));
            csv.WriteField(Utc(r.End));
            csv.WriteField(Number(r.SetpointC));
            csv.WriteField(r.Excursions.ToString(CultureInfo.InvariantCulture));
            csv.WriteField(Number(r.LEffNm));
            csv.WriteField(r.Verdict ?? "");
            csv.WriteField(string.Join(' ', r.Wafers));
        });
    }

    /// <summary>One row per alert: the alerts table's columns, suppressed ones marked.</summary>
    public static string Alerts(IReadOnlyList<AlertView> alerts)
    {
        ArgumentNullException.ThrowIfNull(alerts);
        return Write(["alert", "severity", "state", "suppressed_by_design", "chamber", "run", "message", "raised_utc", "cleared_utc", "acknowledged_by", "comment"],
            alerts, (csv, a) =>
            {
                csv.WriteField(a.AlertId);
                csv.WriteField(a.Severity.ToString());
                csv.WriteField(a.State.ToString());
                csv.WriteField(a.WasSuppressed || a.State == AlertState.Suppressed ? "yes" : "no");
                csv.WriteField(a.Chamber);
                csv.WriteField(a.RunId ?? "");
                csv.WriteField(a.Message);
                csv.WriteField(Utc(a.RaisedAt));
                csv.WriteField(Utc(a.ClearedAt));
                csv.WriteField(a.AcknowledgedBy ?? "");
                csv.WriteField(a.Comment ?? "");
            });
    }

    /// <summary>One row per wafer: the wafer list's columns (mean radius in nm, blank when not measured).</summary>
    public static string Wafers(IReadOnlyList<WaferListRow> wafers)
    {
        ArgumentNullException.ThrowIfNull(wafers);
        return Write(["wafer", "run", "chamber", "process", "verdict", "date_utc", "mean_radius_nm", "fields"], wafers, (csv, w) =>
        {
            csv.WriteField(w.WaferId);
            csv.WriteField(w.RunId);
            csv.WriteField(w.Chamber);
            csv.WriteField(w.Process);
            csv.WriteField(w.Verdict ?? "");
            csv.WriteField(Utc(w.Date));
            csv.WriteField(Number(w.MeanRadiusNm));
            csv.WriteField(w.Fields.ToString(CultureInfo.InvariantCulture));
        });
    }

    private static string Write<T>(string[] header, IReadOnlyList<T> rows, Action<CsvWriter, T> row)
    {
        using var text = new StringWriter(CultureInfo.InvariantCulture);
        using (var csv = CsvWriter.Create(text, Options, true))
        {
            foreach (string h in header)
            {
                csv.WriteField(h);
            }
            csv.EndRecord();
            foreach (T r in rows)
            {
                row(csv, r);
                csv.EndRecord();
            }
        }
        return text.ToString();
    }

    private static string Utc(DateTimeOffset? t) => t is { } v ? v.UtcDateTime.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture) : "";

    private static string Number(double? v) => v is { } x && double.IsFinite(x) ? x.ToString("R", CultureInfo.InvariantCulture) : "";
}
