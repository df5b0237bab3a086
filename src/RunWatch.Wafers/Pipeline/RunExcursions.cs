using RunWatch.Core.Thermal;
using RunWatch.Reports.Model;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Reads the thermal figures the run tracker stored with a run (its excursion summaries and growth window) into the
/// shapes the verdict and the report need (the typed <see cref="RunThermalSummary"/> and
/// <see cref="RunExcursionRecord"/>s of Storage). Times are seconds from the run's start. Every excursion is listed; only
/// those that overlap the growth window count for the verdict (ramps and cool-down lag the setpoint by design).
/// </summary>
internal sealed record RunExcursions(IReadOnlyList<ExcursionRow> Rows, int? Count, double? MaxAbsRelativeLChange)
{
    public static RunExcursions From(RunRecord? run)
    {
        if (run?.Excursions is not { } excursions)
        {
            // A closed run with figures but no excursion list had none; an unknown run leaves the rule unmeasured.
            return new RunExcursions([], run?.LEffNm is null ? null : 0, run?.LEffNm is null ? null : 0);
        }
        var rows = new List<ExcursionRow>();
        double maxAbs = 0;
        int inWindow = 0;
        GrowthWindow window = RunThermalSummary.GrowthWindowOf(run);
        foreach (RunExcursionRecord e in excursions)
        {
            double start = (e.Start - run.StartedAt).TotalSeconds;
            double end = (e.End - run.StartedAt).TotalSeconds;
            double changeNm = e.LengthChangeNm ?? double.NaN;
            double rel = double.IsFinite(changeNm) && run.LEffNm is > 0 ? changeNm / run.LEffNm.Value : double.NaN;
            bool overlaps = !(end < window.StartS || start > window.EndS);
            if (overlaps)
            {
                inWindow++;
                maxAbs = Math.Max(maxAbs, double.IsFinite(rel) ? Math.Abs(rel) : 0);
            }
            string severity = e.Severity.ToString();
            rows.Add(new ExcursionRow(start, end, e.PeakValueC, e.PeakDeviationK, rel,
                (e.Closed ? severity : severity + " (still open at run end)") + (overlaps ? ", in the growth window" : ", outside the growth window")));
        }
        return new RunExcursions(rows, inWindow, maxAbs);
    }
}
