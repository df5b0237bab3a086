using MathNet.Numerics.Statistics;
using RunWatch.Core.Qc;
using RunWatch.Core.Wafers;
using Xunit;

namespace RunWatch.Core.Tests.Wafers;

/// <summary>Per-field figures against MathNet.Numerics statistics over the same wire selection, and the field verdict.</summary>
public sealed class FieldFiguresTests
{
    private static FieldResult Field(params FieldWire[] wires) => new()
    {
        FieldName = "f1.png",
        PixelSizeNm = 4,
        WidthNm = 6000,
        AnalysedHeightNm = 4000,
        Threshold = "otsu",
        AnalysedAreaCm2 = 6000e-7 * 4000e-7,
        Wires = wires,
    };

    [Fact]
    public void From_CountsOnlyVerticalInteriorMeasuredWires()
    {
        var field = Field(
            new FieldWire(1, 0, 0, 30, true, true, null),
            new FieldWire(2, 0, 0, 34, true, true, null),
            new FieldWire(3, 0, 0, 29, true, true, null),
            new FieldWire(4, 0, 0, 80, false, true, null),          // tilted: not counted, lowers the yield
            new FieldWire(5, 0, 0, 90, true, false, null),          // touches the edge: not counted, not interior
            new FieldWire(6, 0, 0, double.NaN, true, true, null));  // droplet only: no radius
        var f = FieldFigures.From(field);
        double[] counted = [30, 34, 29];
        Assert.Equal(3, f.CountedWires);
        Assert.Equal(counted.Mean(), f.MeanRadiusNm, 12);
        Assert.Equal(counted.StandardDeviation(), f.RadiusSdNm, 12);
        Assert.Equal(counted.StandardDeviation() / counted.Mean(), f.RadiusCv, 12);
        // Density counts every object found: 6 per 0.24e-6 cm² (DERIVED).
        Assert.Equal(6 / (6000e-7 * 4000e-7), f.DensityPerCm2, 3);
        Assert.Equal(4.0 / 5, f.VerticalYield, 12);
    }

    [Fact]
    public void From_OneWire_RadiusFiguresNaN()
    {
        var f = FieldFigures.From(Field(new FieldWire(1, 0, 0, 30, true, true, null)));
        Assert.True(double.IsNaN(f.MeanRadiusNm));
        Assert.True(double.IsNaN(f.RadiusCv));
    }

    [Fact]
    public void FieldQc_JudgesOnlyFieldRules()
    {
        var spec = new QcSpecification
        {
            TargetMeanRadiusNm = 30,
            MeanRadiusToleranceNm = 8,
            MeanRadiusWarnToleranceNm = 2,
            MaxRadiusCv = 0.35,
            MinWireCount = 100,
            MaxAbsBiasNm = 4,
            MaxExcursionCount = 2,
        };
        var figures = new FieldFigures(3, 33, 2, 0.06, 1e9, 1);
        QcVerdict verdict = FieldQc.Evaluate(figures, "f1.png", "nw-demo", spec);
        // 33 nm is 3 nm off target: beyond the 2 nm warn window, inside the 8 nm fail window → WARN; 3 wires are not judged against 100.
        Assert.Equal(QcOutcome.Warn, verdict.Outcome);
        Assert.Equal(["mean-radius", "radius-cv"], verdict.Rules.Select(r => r.Rule));
    }
}
