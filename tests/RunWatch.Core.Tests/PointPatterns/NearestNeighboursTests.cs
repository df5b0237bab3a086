using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using Xunit;

namespace RunWatch.Core.Tests.PointPatterns;

public sealed class NearestNeighboursTests
{
    [Theory]
    [InlineData(false, 1)]
    [InlineData(true, 2)]
    public void Compute_RandomPoints_MatchesBruteForce(bool periodic, int seed)
    {
        // Outside reference: brute force over all pairs (minimum-image distances on the torus), seeded points.
        var field = periodic ? CaptureField.PeriodicBox(50, 30) : CaptureField.Rectangle(50, 30);
        Point2D[] points = NucleationSites.Uniform(field, 700, seed);
        var distances = new double[points.Length];
        var neighbours = new int[points.Length];
        NearestNeighbours.Compute(points, field, distances, neighbours);
        for (int i = 0; i < points.Length; i++)
        {
            double best = double.PositiveInfinity;
            for (int j = 0; j < points.Length; j++)
            {
                if (j == i)
                {
                    continue;
                }
                double dx = Math.Abs(points[i].X - points[j].X), dy = Math.Abs(points[i].Y - points[j].Y);
                if (periodic)
                {
                    dx = Math.Min(dx, 50 - dx);
                    dy = Math.Min(dy, 30 - dy);
                }
                best = Math.Min(best, Math.Sqrt((dx * dx) + (dy * dy)));
            }
            Assert.Equal(best, distances[i], 12);
            Assert.NotEqual(i, neighbours[i]);
        }
    }

    [Fact]
    public void Distances_LonePointOnTorus_IsItsOwnImageOnePeriodAway()
    {
        // DERIVED: on a 3 × 5 torus the nearest image of a lone point is 3 away.
        double[] d = NearestNeighbours.Distances([new Point2D(1, 1)], CaptureField.PeriodicBox(3, 5));
        Assert.Equal(3.0, d[0], 12);
    }

    [Fact]
    public void Distances_LonePointInPlainField_IsInfinite()
    {
        double[] d = NearestNeighbours.Distances([new Point2D(1, 1)], CaptureField.Rectangle(3, 5));
        Assert.True(double.IsPositiveInfinity(d[0]));
    }
}
