using RunWatch.Reports.Model;

namespace RunWatch.Reports.Rendering;

/// <summary>The charts of one report, rendered once and shared by the HTML and PDF writers.</summary>
internal sealed record ReportChartSet(ReportChart Thermal, ReportChart Histogram, ReportChart RadiusVersusArea, ReportChart? PredictedVersusMeasured)
{
    public static ReportChartSet Render(WaferReport report)
    {
        bool anyPrediction = report.Wires.Any(w => double.IsFinite(w.PredictedRadiusNm));
        return new ReportChartSet(
            ReportCharts.Thermal(report.Thermal),
            ReportCharts.RadiusHistogram(report.Wires, report.Prediction),
            ReportCharts.RadiusVersusArea(report.Wires, report.Model, report.CaptureRadiusNm),
            anyPrediction ? ReportCharts.PredictedVersusMeasured(report.Wires) : null);
    }

    /// <summary>True when <paramref name="bytes"/> starts with the PNG signature (ISO/IEC 15948 §5.2).</summary>
    public static bool IsPng(ReadOnlySpan<byte> bytes) =>
        bytes.Length > 8 && bytes[..8].SequenceEqual((ReadOnlySpan<byte>)[0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]);
}
