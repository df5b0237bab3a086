using RunWatch.Core.Geometry;
using Xunit;

namespace RunWatch.Core.Tests.Geometry;

public sealed class ConvexPolygonMathTests
{
    private static readonly double[] SquareX = [-1, 1, 1, -1];
    private static readonly double[] SquareY = [-1, -1, 1, 1];

    [Fact]
    public void Area_UnitSquare_IsFour()
    {
        // DERIVED: side 2.
        Assert.Equal(4.0, ConvexPolygonMath.Area(SquareX, SquareY), 12);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(1.0)]
    public void DiscIntersectionArea_DiscInsideSquare_IsWholeDisc(double r)
    {
        // DERIVED: a disc of radius r <= 1 centred in the square [-1, 1]² lies inside it: πr².
        Assert.Equal(Math.PI * r * r, ConvexPolygonMath.DiscIntersectionArea(SquareX, SquareY, r), 12);
    }

    [Fact]
    public void DiscIntersectionArea_SquareInsideDisc_IsSquare()
    {
        // DERIVED: r = √2 circumscribes the square.
        Assert.Equal(4.0, ConvexPolygonMath.DiscIntersectionArea(SquareX, SquareY, Math.Sqrt(2.0) + 1e-12), 10);
    }

    [Theory]
    [InlineData(1.1)]
    [InlineData(1.2)]
    [InlineData(1.4)]
    public void DiscIntersectionArea_DiscCutByFourSides_MatchesSegmentFormula(double r)
    {
        // DERIVED: πr² minus four circular segments beyond |x| = 1 (or |y| = 1); a segment at distance h from the
        // centre has area r²·acos(h/r) − h·√(r² − h²). The segments do not overlap while r < √2.
        double segment = (r * r * Math.Acos(1.0 / r)) - Math.Sqrt((r * r) - 1.0);
        double expected = (Math.PI * r * r) - (4.0 * segment);
        Assert.Equal(expected, ConvexPolygonMath.DiscIntersectionArea(SquareX, SquareY, r), 12);
    }

    [Fact]
    public void DiscIntersectionArea_OffCentreTriangle_MatchesMathNetQuadrature()
    {
        // Outside reference: MathNet.Numerics 2-D Gauss–Legendre quadrature of the indicator over the disc,
        // integrated in polar coordinates (exact radial limit per angle from the convex polygon's support).
        double[] xs = [-0.3, 1.5, 0.2];
        double[] ys = [-0.8, -0.2, 1.3];
        const double r = 1.0;
        double analytic = ConvexPolygonMath.DiscIntersectionArea(xs, ys, r);
        double numeric = MathNet.Numerics.Integrate.GaussKronrod(
            theta => { double rho = Math.Min(r, RayExit(xs, ys, theta)); return 0.5 * rho * rho; },
            0, 2 * Math.PI, 1e-12, 20, 61);
        Assert.Equal(numeric, analytic, 8);
    }

    /// <summary>Distance from the origin (inside the convex polygon) along angle θ to the polygon boundary.</summary>
    private static double RayExit(double[] xs, double[] ys, double theta)
    {
        double dx = Math.Cos(theta), dy = Math.Sin(theta), best = double.PositiveInfinity;
        for (int i = 0; i < xs.Length; i++)
        {
            int j = (i + 1) % xs.Length;
            double ex = xs[j] - xs[i], ey = ys[j] - ys[i];
            double den = (dx * ey) - (dy * ex);
            if (Math.Abs(den) < 1e-15)
            {
                continue;
            }
            double t = ((xs[i] * ey) - (ys[i] * ex)) / den;
            double u = ((xs[i] * dy) - (ys[i] * dx)) / den;
            if (t > 0 && u >= 0 && u <= 1)
            {
                best = Math.Min(best, t);
            }
        }
        return best;
    }
}
