using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;

namespace RunWatch.Reports.Model;

/// <summary>Fills a <see cref="WaferQcInput"/> from the report's parts, so the verdict and the report show the same figures.</summary>
public static class QcInputs
{
    /// <summary>The QC input of a wafer. A missing comparison leaves the bias unmeasured (the rule then warns by default).</summary>
    public static WaferQcInput From(ReportIdentity identity, WireStatistics statistics, ThermalSummary thermal, PredictedVsMeasured? comparison)
    {
        ArgumentNullException.ThrowIfNull(identity);
        ArgumentNullException.ThrowIfNull(statistics);
        ArgumentNullException.ThrowIfNull(thermal);
        int inWindow = 0;
        double maxEffect = 0;
        foreach (ExcursionRow e in thermal.Excursions)
        {
            // An excursion counts against the growth window when it overlaps it.
            if (e.EndS >= thermal.GrowthWindowStartS && e.StartS <= thermal.GrowthWindowEndS)
            {
                inWindow++;
                maxEffect = Math.Max(maxEffect, Math.Abs(e.RelativeLChange));
            }
        }
        return new WaferQcInput(
            identity.WaferId,
            identity.Recipe,
            statistics.Count,
            statistics.MeanRadiusNm,
            statistics.RadiusCv,
            statistics.DensityPerCm2,
            statistics.VerticalYield,
            comparison?.BiasNm,
            inWindow,
            maxEffect,
            thermal.CoverageFraction);
    }
}
