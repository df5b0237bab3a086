using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class MeasuredCaptureAreasTests
{
    [Fact]
    public void ForFields_TwoFields_FillsSlotsFieldByFieldWithNaNForGuarded()
    {
        // DERIVED: an isolated wire 1000 nm from every edge with L = 300 nm has the whole disc: Â = 1.
        // A wire 100 nm from the edge has its disc crossing the edge: guarded (NaN).
        var field = CaptureField.Rectangle(2000, 2000);
        var first = new MeasuredField(field, [new Point2D(1000, 1000), new Point2D(100, 1000)]);
        var second = new MeasuredField(field, [new Point2D(900, 1000), new Point2D(1100, 1000), new Point2D(1000, 1900)]);
        CaptureAreaEvaluator evaluator = MeasuredCaptureAreas.ForFields([first, second]);

        var areas = new double[5];
        evaluator(300, areas);

        Assert.Equal(1, areas[0], 9);
        Assert.True(double.IsNaN(areas[1]));
        // Two wires 200 nm apart split their discs along the bisector: each keeps 1 − (segment area)/(πL²),
        // segment of a disc of radius L cut at distance h = 100 nm: L²·acos(h/L) − h·√(L² − h²) (DERIVED).
        double segment = (300 * 300 * Math.Acos(100.0 / 300)) - (100 * Math.Sqrt((300 * 300) - (100 * 100)));
        double expected = 1 - (segment / (Math.PI * 300 * 300));
        Assert.Equal(expected, areas[2], 6);
        Assert.Equal(expected, areas[3], 6);
        Assert.True(double.IsNaN(areas[4]));
    }

    [Fact]
    public void ForFields_WrongSlotCount_Throws()
    {
        var field = CaptureField.Rectangle(2000, 2000);
        CaptureAreaEvaluator evaluator = MeasuredCaptureAreas.ForFields([new MeasuredField(field, [new Point2D(1000, 1000)])]);
        Assert.Throws<ArgumentException>(() => evaluator(300, new double[2]));
    }
}
