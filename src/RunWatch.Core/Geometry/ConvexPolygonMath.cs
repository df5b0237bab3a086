namespace RunWatch.Core.Geometry;

/// <summary>
/// Exact area formulas for a convex polygon and for its intersection with a disc centred at the origin. Polygons
/// are given as coordinate spans relative to the disc centre, counter-clockwise (positive orientation).
/// </summary>
internal static class ConvexPolygonMath
{
    /// <summary>Shoelace area (signed: positive for counter-clockwise).</summary>
    public static double Area(ReadOnlySpan<double> xs, ReadOnlySpan<double> ys)
    {
        int n = xs.Length;
        double twice = 0.0;
        for (int i = 0, j = n - 1; i < n; j = i++)
        {
            twice += (xs[j] * ys[i]) - (xs[i] * ys[j]);
        }
        return 0.5 * twice;
    }

    /// <summary>
    /// Area of polygon ∩ disc(origin, r): the sum over edges of the signed area of triangle (origin, a, b) ∩ disc.
    /// Each edge splits at its circle crossings into pieces inside the disc (a triangle, cross/2) and outside it
    /// (a circular sector, r²·angle/2). DERIVED: this decomposition is exact for any simple polygon.
    /// </summary>
    public static double DiscIntersectionArea(ReadOnlySpan<double> xs, ReadOnlySpan<double> ys, double r)
    {
        int n = xs.Length;
        double r2 = r * r;
        double total = 0.0;
        for (int i = 0; i < n; i++)
        {
            int j = i + 1 == n ? 0 : i + 1;
            total += TriangleDiscArea(xs[i], ys[i], xs[j], ys[j], r, r2);
        }
        return total;
    }

    private static double TriangleDiscArea(double ax, double ay, double bx, double by, double r, double r2)
    {
        double dx = bx - ax, dy = by - ay;
        double qa = (dx * dx) + (dy * dy);
        if (qa <= 0.0)
        {
            return 0.0;
        }
        double qb = 2.0 * ((ax * dx) + (ay * dy));
        double qc = (ax * ax) + (ay * ay) - r2;
        double disc = (qb * qb) - (4.0 * qa * qc);
        if (disc <= 0.0)
        {
            return Sector(ax, ay, bx, by, r2);
        }
        double sq = Math.Sqrt(disc);
        double t1 = Math.Clamp((-qb - sq) / (2.0 * qa), 0.0, 1.0);
        double t2 = Math.Clamp((-qb + sq) / (2.0 * qa), 0.0, 1.0);
        double p1x = ax + (t1 * dx), p1y = ay + (t1 * dy);
        double p2x = ax + (t2 * dx), p2y = ay + (t2 * dy);
        double area = 0.0;
        if (t1 > 0.0)
        {
            area += Sector(ax, ay, p1x, p1y, r2);
        }
        area += 0.5 * ((p1x * p2y) - (p2x * p1y));
        if (t2 < 1.0)
        {
            area += Sector(p2x, p2y, bx, by, r2);
        }
        return area;
    }

    private static double Sector(double ux, double uy, double vx, double vy, double r2) =>
        0.5 * r2 * Math.Atan2((ux * vy) - (vx * uy), (ux * vx) + (uy * vy));

    /// <summary>
    /// Outline of polygon ∩ disc(origin, r) as a polygon: kept edges plus arcs sampled every
    /// <paramref name="arcStepRadians"/> at most. Appends to <paramref name="output"/>, offset by (ox, oy).
    /// </summary>
    public static void AppendDiscIntersectionOutline(
        ReadOnlySpan<double> xs, ReadOnlySpan<double> ys, double r, double arcStepRadians, double ox, double oy, List<Point2D> output)
    {
        int n = xs.Length;
        double r2 = r * r;
        for (int i = 0; i < n; i++)
        {
            int j = i + 1 == n ? 0 : i + 1;
            double ax = xs[i], ay = ys[i], bx = xs[j], by = ys[j];
            double dx = bx - ax, dy = by - ay;
            double qa = (dx * dx) + (dy * dy);
            if (qa <= 0.0)
            {
                continue;
            }
            double qb = 2.0 * ((ax * dx) + (ay * dy));
            double qc = (ax * ax) + (ay * ay) - r2;
            double disc = (qb * qb) - (4.0 * qa * qc);
            if (disc <= 0.0)
            {
                AppendArc(ax, ay, bx, by, r, arcStepRadians, ox, oy, output);
                continue;
            }
            double sq = Math.Sqrt(disc);
            double t1 = Math.Clamp((-qb - sq) / (2.0 * qa), 0.0, 1.0);
            double t2 = Math.Clamp((-qb + sq) / (2.0 * qa), 0.0, 1.0);
            double p1x = ax + (t1 * dx), p1y = ay + (t1 * dy);
            if (t1 > 0.0)
            {
                AppendArc(ax, ay, p1x, p1y, r, arcStepRadians, ox, oy, output);
            }
            if (t2 > t1)
            {
                output.Add(new Point2D(p1x + ox, p1y + oy));
            }
            if (t2 < 1.0)
            {
                AppendArc(ax + (t2 * dx), ay + (t2 * dy), bx, by, r, arcStepRadians, ox, oy, output);
            }
        }
    }

    private static void AppendArc(
        double ux, double uy, double vx, double vy, double r, double step, double ox, double oy, List<Point2D> output)
    {
        double start = Math.Atan2(uy, ux);
        double sweep = Math.Atan2((ux * vy) - (vx * uy), (ux * vx) + (uy * vy));
        int pieces = Math.Max(1, (int)Math.Ceiling(Math.Abs(sweep) / step));
        for (int k = 0; k < pieces; k++)
        {
            double a = start + (sweep * k / pieces);
            output.Add(new Point2D((r * Math.Cos(a)) + ox, (r * Math.Sin(a)) + oy));
        }
    }
}
