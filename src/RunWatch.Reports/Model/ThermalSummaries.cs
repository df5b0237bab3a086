using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;

namespace RunWatch.Reports.Model;

/// <summary>Builds a report's <see cref="ThermalSummary"/> from the thermal room's results (µm → nm, % → fraction).</summary>
public static class ThermalSummaries
{
    private const double NanometresPerMicrometre = 1000;

    /// <summary>The thermal part of a report.</summary>
    /// <param name="result">Diffusion length of the growth window.</param>
    /// <param name="timesS">Sample times, s after run start.</param>
    /// <param name="temperaturesC">True substrate temperatures (°C).</param>
    /// <param name="excursions">Qualified excursions of the run.</param>
    /// <param name="setpointC">Growth setpoint (°C), or null.</param>
    /// <param name="gapPolicy">The gap policy in words, for the report.</param>
    public static ThermalSummary From(
        DiffusionLengthResult result,
        IReadOnlyList<double> timesS,
        IReadOnlyList<double> temperaturesC,
        IReadOnlyList<ExcursionSummary> excursions,
        double? setpointC,
        string gapPolicy)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(timesS);
        ArgumentNullException.ThrowIfNull(temperaturesC);
        ArgumentNullException.ThrowIfNull(excursions);
        if (timesS.Count != temperaturesC.Count)
        {
            throw new ArgumentException($"{timesS.Count} times but {temperaturesC.Count} temperatures.", nameof(temperaturesC));
        }
        var rows = new ExcursionRow[excursions.Count];
        for (int i = 0; i < rows.Length; i++)
        {
            ExcursionSummary e = excursions[i];
            // ΔL/L: the excursion's share of L_eff (L with it minus L with the setpoint in its place, over L).
            double change = double.IsFinite(e.ExcessIntegralCmSq) && result.EffectiveLengthUm > 0
                ? e.LengthChangeUm(result.IntegralCmSq, result.ConventionFactor) / result.EffectiveLengthUm
                : double.NaN;
            string direction = e.PeakDeviationK >= 0 ? "over-temperature" : "under-temperature";
            string severity = e.Severity == ExcursionSeverity.Alarm ? "alarm" : "warning";
            string open = e.Closed ? "" : ", still open at end of data";
            rows[i] = new ExcursionRow(e.StartS, e.EndS, e.PeakValueC, e.PeakDeviationK, change, $"{direction} ({severity}{open})");
        }
        return new ThermalSummary(
            timesS,
            temperaturesC,
            setpointC,
            result.Window.StartS,
            result.Window.EndS,
            rows,
            (result.NominalLengthUm ?? double.NaN) * NanometresPerMicrometre,
            result.EffectiveLengthUm * NanometresPerMicrometre,
            result.EffectiveTemperatureC,
            result.ConventionFactor,
            result.CoveragePercent / 100,
            gapPolicy ?? "");
    }
}
