namespace RunWatch.Imaging.Measurement;

/// <summary>
/// Convex hull (Andrew's monotone chain, Andrew 1979) and caliper measures on it. Feret diameters follow
/// Toussaint, G. T. (1983) "Solving geometric problems with the rotating calipers": the minimum width is attained
/// with one caliper flush with a hull edge, so every edge direction is tried; the maximum is the hull's diameter.
/// </summary>
internal static class ConvexHull
{
    /// <summary>Sorts <paramref name="points"/> in place and writes the hull (counter-clockwise in y-down axes, no repeated end) into <paramref name="hull"/>; returns its vertex count.</summary>
    public static int Build(Span<(int X, int Y)> points, Span<(int X, int Y)> hull)
    {
        int n = points.Length;
        if (n == 0)
        {
            return 0;
        }
        points.Sort(static (a, b) => a.X != b.X ? a.X.CompareTo(b.X) : a.Y.CompareTo(b.Y));
        if (n < 3)
        {
            points.CopyTo(hull);
            return n;
        }
        int k = 0;
        for (int i = 0; i < n; i++)
        {
            while (k >= 2 && Cross(hull[k - 2], hull[k - 1], points[i]) <= 0)
            {
                k--;
            }
            hull[k++] = points[i];
        }
        for (int i = n - 2, lower = k + 1; i >= 0; i--)
        {
            while (k >= lower && Cross(hull[k - 2], hull[k - 1], points[i]) <= 0)
            {
                k--;
            }
            hull[k++] = points[i];
        }
        return k - 1;
    }

    private static long Cross((int X, int Y) o, (int X, int Y) a, (int X, int Y) b) =>
        (long)(a.X - o.X) * (b.Y - o.Y) - (long)(a.Y - o.Y) * (b.X - o.X);

    /// <summary>Polygon area by the shoelace formula.</summary>
    public static double Area(ReadOnlySpan<(int X, int Y)> hull)
    {
        long twice = 0;
        for (int i = 0; i < hull.Length; i++)
        {
            var a = hull[i];
            var b = hull[(i + 1) % hull.Length];
            twice += (long)a.X * b.Y - (long)b.X * a.Y;
        }
        return Math.Abs(twice) / 2.0;
    }

    /// <summary>Minimum and maximum caliper (Feret) diameters of a convex polygon.</summary>
    public static (double Min, double Max) Feret(ReadOnlySpan<(int X, int Y)> hull)
    {
        int n = hull.Length;
        if (n == 0)
        {
            return (0, 0);
        }
        long maxD2 = 0;
        for (int i = 0; i < n; i++)
        {
            for (int j = i + 1; j < n; j++)
            {
                long dx = hull[i].X - hull[j].X;
                long dy = hull[i].Y - hull[j].Y;
                maxD2 = Math.Max(maxD2, dx * dx + dy * dy);
            }
        }
        if (n < 3)
        {
            return (0, Math.Sqrt(maxD2));
        }
        double minWidth = double.PositiveInfinity;
        for (int i = 0; i < n; i++)
        {
            var a = hull[i];
            var b = hull[(i + 1) % n];
            double len = Math.Sqrt((double)(b.X - a.X) * (b.X - a.X) + (double)(b.Y - a.Y) * (b.Y - a.Y));
            if (len == 0)
            {
                continue;
            }
            double far = 0;
            for (int j = 0; j < n; j++)
            {
                double d = Math.Abs(Cross(a, b, hull[j])) / len;
                far = Math.Max(far, d);
            }
            minWidth = Math.Min(minWidth, far);
        }
        return (minWidth, Math.Sqrt(maxD2));
    }
}
