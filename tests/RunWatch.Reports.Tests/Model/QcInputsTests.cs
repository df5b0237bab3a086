using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using RunWatch.Reports.Tests.Support;
using Xunit;

namespace RunWatch.Reports.Tests.Model;

public sealed class QcInputsTests
{
    [Fact]
    public void From_SampleReport_CountsOnlyExcursionsOverlappingTheWindow()
    {
        WaferReport report = SampleReport.Build();
        ThermalSummary thermal = report.Thermal with
        {
            Excursions = [.. report.Thermal.Excursions, new ExcursionRow(100, 200, 400, -8, -0.2, "during ramp, before the window")],
        };
        var input = QcInputs.From(report.Identity, report.Statistics, thermal, report.Comparison);
        Assert.Equal(1, input.ExcursionCount);
        Assert.Equal(0.031, input.MaxAbsRelativeLChange);
        Assert.Equal(report.Statistics.MeanRadiusNm, input.MeanRadiusNm);
        Assert.Equal(report.Comparison!.BiasNm, input.PredictionBiasNm);
        Assert.Null(QcInputs.From(report.Identity, report.Statistics, thermal, null).PredictionBiasNm);
    }

    [Fact]
    public void WireStatistics_From_MatchesMathNetStatistics()
    {
        // Reference: MathNet.Numerics Statistics (Mean, StandardDeviation, Median).
        WaferReport report = SampleReport.Build();
        double[] radii = report.Wires.Select(w => w.RadiusNm).ToArray();
        var stats = WireStatistics.From(report.Wires, 2.5e-6);
        Assert.Equal(MathNet.Numerics.Statistics.Statistics.Mean(radii), stats.MeanRadiusNm, 10);
        Assert.Equal(MathNet.Numerics.Statistics.Statistics.StandardDeviation(radii), stats.RadiusSdNm, 10);
        Assert.Equal(MathNet.Numerics.Statistics.Statistics.Median(radii), stats.MedianRadiusNm, 10);
        Assert.Equal(radii.Length / 2.5e-6, stats.DensityPerCm2, 6);
    }
}
