using RunWatch.Core.Geometry;

namespace RunWatch.Core.Tests.Geometry;

/// <summary>
/// Slow, independent reference: each cell is the field clipped by every other point's bisector (O(N²)), and the
/// disc is a 4096-gon clipped the same way, so the disc area comes from the shoelace formula, not from the
/// analytic circle–polygon formula under test (DERIVED: the 4096-gon's area is πr²·sin(2π/n)/(2π/n), a
/// relative deficit of 3.9e-7, which the comparison tolerance allows for).
/// </summary>
internal static class NaiveCaptureZone
{
    public static double Area(IReadOnlyList<Point2D> points, int index, double x0, double y0, double x1, double y1, double length)
    {
        Point2D p = points[index];
        List<(double X, double Y)> poly = double.IsFinite(length)
            ? Disc(p, length)
            : [(x0, y0), (x1, y0), (x1, y1), (x0, y1)];
        poly = Clip(poly, 1, 0, x1);
        poly = Clip(poly, -1, 0, -x0);
        poly = Clip(poly, 0, 1, y1);
        poly = Clip(poly, 0, -1, -y0);
        for (int j = 0; j < points.Count; j++)
        {
            if (j == index)
            {
                continue;
            }
            Point2D q = points[j];
            double nx = q.X - p.X, ny = q.Y - p.Y;
            double c = ((q.X * q.X) + (q.Y * q.Y) - (p.X * p.X) - (p.Y * p.Y)) / 2.0;
            poly = Clip(poly, nx, ny, c);
        }
        double twice = 0;
        for (int i = 0; i < poly.Count; i++)
        {
            var a = poly[i];
            var b = poly[(i + 1) % poly.Count];
            twice += (a.X * b.Y) - (b.X * a.Y);
        }
        return Math.Abs(twice) / 2.0;
    }

    private static List<(double X, double Y)> Disc(Point2D p, double r)
    {
        const int n = 4096;
        var poly = new List<(double X, double Y)>(n);
        for (int k = 0; k < n; k++)
        {
            double a = 2 * Math.PI * k / n;
            poly.Add((p.X + (r * Math.Cos(a)), p.Y + (r * Math.Sin(a))));
        }
        return poly;
    }

    /// <summary>Keeps the part with nx·x + ny·y ≤ c.</summary>
    private static List<(double X, double Y)> Clip(List<(double X, double Y)> poly, double nx, double ny, double c)
    {
        var result = new List<(double X, double Y)>(poly.Count + 1);
        for (int i = 0; i < poly.Count; i++)
        {
            var a = poly[i];
            var b = poly[(i + 1) % poly.Count];
            double fa = (nx * a.X) + (ny * a.Y) - c, fb = (nx * b.X) + (ny * b.Y) - c;
            if (fa <= 0)
            {
                result.Add(a);
            }
            if ((fa <= 0) != (fb <= 0))
            {
                double t = fa / (fa - fb);
                result.Add((a.X + (t * (b.X - a.X)), a.Y + (t * (b.Y - a.Y))));
            }
        }
        return result;
    }
}
