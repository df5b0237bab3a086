using RunWatch.Core.ControlCharts;
using Xunit;

namespace RunWatch.Core.Tests.ControlCharts;

/// <summary>Trend charts: baseline choice and the rules judged against the baseline's limits (worked sequences, DERIVED).</summary>
public sealed class TrendChartTests
{
    [Fact]
    public void Build_BaselineIsFirstAcceptedFinitePoints()
    {
        double[] values = [30, double.NaN, 31, 29, 30, 31, 40];
        bool[] accepted = [true, true, false, true, true, true, true];
        var chart = TrendChart.Build(values, accepted, 3);
        Assert.Equal([0, 3, 4], chart.BaselineIndices);
        // Baseline 30, 29, 30: mean 29.667; moving ranges 1, 1 → σ̂ = 1/d₂.
        Assert.Equal(89.0 / 3, chart.Limits!.Centre, 12);
        Assert.Equal(1 / IndividualsLimits.D2, chart.Limits.Sigma, 12);
        // 40 is (40 − 29.667)·d₂ ≈ 11.7 σ above: rule 1 at index 6.
        Assert.Contains(new RunRuleSignal(6, RunRule.OneBeyondThreeSigma), chart.Signals);
    }

    [Fact]
    public void Build_BaselineTooShort_NoLimitsNoSignals()
    {
        var chart = TrendChart.Build([30, 90], [true, false], 5);
        Assert.Equal([0], chart.BaselineIndices);
        Assert.Null(chart.Limits);
        Assert.Empty(chart.Signals);
    }

    [Fact]
    public void Build_EightAboveCentre_Rule4OnEighth()
    {
        // Baseline alternates 9, 11 (centre 10, σ̂ = 2/d₂ ≈ 1.77); the last baseline point (11) and the points at 10.5
        // after it stay inside 1σ but above the centre: the eighth in a row is index 10, and index 11 continues it.
        double[] values = [9, 11, 9, 11, 10.5, 10.5, 10.5, 10.5, 10.5, 10.5, 10.5, 10.5];
        bool[] accepted = [.. values.Select(_ => true)];
        var chart = TrendChart.Build(values, accepted, 4);
        Assert.Equal([new RunRuleSignal(10, RunRule.EightOnOneSide), new RunRuleSignal(11, RunRule.EightOnOneSide)], chart.Signals);
    }

    [Fact]
    public void MeanOfFinite_SkipsNaN()
    {
        Assert.Equal(2, TrendChart.MeanOfFinite([1, double.NaN, 3]), 12);
        Assert.True(double.IsNaN(TrendChart.MeanOfFinite([double.NaN])));
    }
}
