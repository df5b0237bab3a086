using System.Text.Json;
using RunWatch.Reports.Model;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Reads the thermal figures the run tracker stored with a run (its excursion summaries and growth window) into the
/// shapes the verdict and the report need. Times are seconds from the run's start. Every excursion is listed; only
/// those that overlap the growth window count for the verdict (ramps and cool-down lag the setpoint by design).
/// </summary>
internal sealed record RunExcursions(IReadOnlyList<ExcursionRow> Rows, int? Count, double? MaxAbsRelativeLChange)
{
    public static RunExcursions From(RunRecord? run)
    {
        if (run?.ExcursionsJson is not { Length: > 0 } json)
        {
            // A closed run with figures but no excursion list had none; an unknown run leaves the rule unmeasured.
            return new RunExcursions([], run?.LEffNm is null ? null : 0, run?.LEffNm is null ? null : 0);
        }
        var rows = new List<ExcursionRow>();
        double maxAbs = 0;
        int inWindow = 0;
        var (windowStart, windowEnd) = GrowthWindow(run);
        using var doc = JsonDocument.Parse(json);
        foreach (JsonElement e in doc.RootElement.EnumerateArray())
        {
            double start = Seconds(e, "start", run.StartedAt);
            double end = Seconds(e, "end", run.StartedAt);
            double changeNm = Number(e, "lengthChangeNm");
            double rel = double.IsFinite(changeNm) && run.LEffNm is > 0 ? changeNm / run.LEffNm.Value : double.NaN;
            bool overlaps = !(end < windowStart || start > windowEnd);
            if (overlaps)
            {
                inWindow++;
                maxAbs = Math.Max(maxAbs, double.IsFinite(rel) ? Math.Abs(rel) : 0);
            }
            string severity = Text(e, "severity");
            bool closed = !e.TryGetProperty("closed", out JsonElement c) || c.ValueKind != JsonValueKind.False;
            rows.Add(new ExcursionRow(start, end, Number(e, "peakValueC"), Number(e, "peakDeviationK"), rel,
                (closed ? severity : severity + " (still open at run end)") + (overlaps ? ", in the growth window" : ", outside the growth window")));
        }
        return new RunExcursions(rows, inWindow, maxAbs);
    }

    /// <summary>Growth window from the run's summary, in seconds from the run's start; the whole run when not recorded.</summary>
    public static (double Start, double End) GrowthWindow(RunRecord run)
    {
        double whole = ((run.EndedAt ?? run.LastSampleAt ?? run.StartedAt) - run.StartedAt).TotalSeconds;
        if (run.SummaryJson is not { Length: > 0 } json)
        {
            return (0, whole);
        }
        using var doc = JsonDocument.Parse(json);
        double start = Number(doc.RootElement, "windowStartS");
        double end = Number(doc.RootElement, "windowEndS");
        return double.IsFinite(start) && double.IsFinite(end) && end > start ? (start, end) : (0, whole);
    }

    /// <summary>The convention factor c used for the run's L (1 when not recorded).</summary>
    public static double ConventionFactor(RunRecord? run)
    {
        if (run?.SummaryJson is not { Length: > 0 } json)
        {
            return 1;
        }
        using var doc = JsonDocument.Parse(json);
        double c = Number(doc.RootElement, "conventionFactor");
        return double.IsFinite(c) && c > 0 ? c : 1;
    }

    private static double Seconds(JsonElement e, string name, DateTimeOffset origin) =>
        e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.String && v.TryGetDateTimeOffset(out DateTimeOffset t)
            ? (t - origin).TotalSeconds
            : double.NaN;

    private static string Text(JsonElement e, string name) =>
        e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.String ? v.GetString() ?? "" : "";

    private static double Number(JsonElement e, string name) =>
        e.ValueKind == JsonValueKind.Object && e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.Number ? v.GetDouble() : double.NaN;
}
