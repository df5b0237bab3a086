namespace RunWatch.Simulation.Sem;

/// <summary>Seeded wire sites for generated fields: a hard-core scatter with some touching pairs.</summary>
public static class SemSites
{
    /// <summary>
    /// About <paramref name="count"/> sites at least <paramref name="minDistance"/> apart inside
    /// [margin, width − margin] × [margin, usableHeight − margin] (dart throwing on a grid, bounded tries), then for a
    /// share <paramref name="touchingFraction"/> of them a partner at <paramref name="touchingDistance"/>, so the two wires touch.
    /// </summary>
    public static IReadOnlyList<(double X, double Y)> Scatter(
        int width, int usableHeight, int count, double minDistance, double touchingFraction, double touchingDistance, int seed, double margin = 0)
    {
        var random = new Random(seed);
        double cell = minDistance / Math.Sqrt(2);
        int gw = Math.Max(1, (int)Math.Ceiling(width / cell));
        int gh = Math.Max(1, (int)Math.Ceiling(usableHeight / cell));
        var grid = new int[gw * gh];
        Array.Fill(grid, -1);
        var sites = new List<(double X, double Y)>(count + (int)(count * touchingFraction) + 1);
        double min2 = minDistance * minDistance;
        bool Free(double x, double y, int ignore)
        {
            int gx = (int)(x / cell), gy = (int)(y / cell);
            for (int j = Math.Max(0, gy - 2); j <= Math.Min(gh - 1, gy + 2); j++)
            {
                for (int i = Math.Max(0, gx - 2); i <= Math.Min(gw - 1, gx + 2); i++)
                {
                    int s = grid[j * gw + i];
                    if (s >= 0 && s != ignore)
                    {
                        double dx = sites[s].X - x, dy = sites[s].Y - y;
                        if (dx * dx + dy * dy < min2)
                        {
                            return false;
                        }
                    }
                }
            }
            return true;
        }
        long tries = 0;
        long maxTries = 30L * count + 1000;
        while (sites.Count < count && tries++ < maxTries)
        {
            double x = margin + random.NextDouble() * (width - 2 * margin);
            double y = margin + random.NextDouble() * (usableHeight - 2 * margin);
            int gx = (int)(x / cell), gy = (int)(y / cell);
            if (gx >= gw || gy >= gh || grid[gy * gw + gx] >= 0 || !Free(x, y, -1))
            {
                continue;
            }
            grid[gy * gw + gx] = sites.Count;
            sites.Add((x, y));
        }
        int primaries = sites.Count;
        for (int s = 0; s < primaries; s++)
        {
            if (random.NextDouble() >= touchingFraction)
            {
                continue;
            }
            double angle = random.NextDouble() * 2 * Math.PI;
            double x = sites[s].X + touchingDistance * Math.Cos(angle);
            double y = sites[s].Y + touchingDistance * Math.Sin(angle);
            if (x < margin || y < margin || x > width - margin || y > usableHeight - margin)
            {
                continue;
            }
            // The partner may sit closer than the hard core to its own site only.
            if (!Free(x, y, s))
            {
                continue;
            }
            sites.Add((x, y));
        }
        return sites;
    }
}
