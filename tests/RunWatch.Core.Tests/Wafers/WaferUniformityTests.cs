using MathNet.Numerics;
using MathNet.Numerics.Statistics;
using RunWatch.Core.Wafers;
using Xunit;

namespace RunWatch.Core.Tests.Wafers;

/// <summary>Across-wafer uniformity and radial trend against MathNet.Numerics (reference library) and worked examples.</summary>
public sealed class WaferUniformityTests
{
    [Fact]
    public void From_RadialSlopeAndCv_MatchMathNet()
    {
        double[] d = [0, 5, 10, 15, 20.6];
        double[] r = [30.2, 30.9, 31.1, 32.4, 33.0];
        var u = WaferUniformity.From(d, r);
        // Reference: MathNet.Numerics Fit.Line (least squares) and sample SD.
        var (a, b) = Fit.Line(d, r);
        Assert.Equal(b, u.RadialSlopeNmPerMm!.Value, 10);
        Assert.Equal(a, u.RadialInterceptNm!.Value, 10);
        Assert.Equal(r.StandardDeviation() / r.Mean(), u.CvOfFieldMeans, 12);
        Assert.Equal(5, u.Fields);
    }

    [Fact]
    public void From_NonUniformity_IsHalfRangeOverMean()
    {
        // Means 28, 30, 32: (32 − 28) / (2 · 30) = 0.0667 (DERIVED by hand).
        var u = WaferUniformity.From([1, 2, 3], [28, 30, 32]);
        Assert.Equal(4.0 / 60, u.NonUniformity, 12);
        Assert.Equal(30, u.MeanOfFieldMeansNm, 12);
    }

    [Fact]
    public void From_SameDistanceOrNaN_NoSlope_NaNLeftOut()
    {
        var same = WaferUniformity.From([10, 10], [30, 31]);
        Assert.Null(same.RadialSlopeNmPerMm);
        var withNaN = WaferUniformity.From([0, 10, 20], [30, double.NaN, 32]);
        Assert.Equal(2, withNaN.Fields);
        Assert.Equal(0.1, withNaN.RadialSlopeNmPerMm!.Value, 12);
        var none = WaferUniformity.From([], []);
        Assert.Equal(0, none.Fields);
    }

    [Fact]
    public void DistanceFromCentre_IsEuclidean()
    {
        Assert.Equal(5, WaferUniformity.DistanceFromCentreMm(-3, 4), 12);
    }

    [Theory]
    [InlineData(20.6, 50.8)]
    [InlineData(25.5, 76.2)]
    [InlineData(140, 300)]
    [InlineData(200, 400)]
    public void WaferOutline_SmallestStandardDiameterHoldingFields(double farthestMm, double expectedDiameterMm)
    {
        Assert.Equal(expectedDiameterMm, WaferOutline.DiameterHoldingMm(farthestMm), 12);
    }
}
