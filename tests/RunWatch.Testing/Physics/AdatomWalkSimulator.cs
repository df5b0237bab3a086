using MathNet.Numerics;
using MathNet.Numerics.Random;
using RunWatch.Core.Geometry;

namespace RunWatch.Testing.Physics;

/// <summary>
/// Independent truth for the radius model: a Monte Carlo of single adatoms on a periodic substrate with circular
/// wires (perfect sinks), surface diffusion and desorption, in continuous space. Shares no code with the grid
/// solver it checks.
/// </summary>
/// <remarks>
/// Each adatom lands at a uniform point at a uniform time of the growth history (so it carries that moment's λ).
/// Landing on a footprint counts for that wire at once (the droplet catches direct flux). Otherwise it moves by
/// walk on spheres (Muller 1956, Ann. Math. Stat. 27, 569; FROM MEMORY): in the largest disc of radius ρ around it
/// that touches no wire, Brownian motion killed at rate 1/τ leaves the disc before desorbing with probability
/// E[e^(−T_exit/τ)] = 1/I₀(ρ/λ) (DERIVED: u(x) = E_x[e^(−T/τ)] solves ∇²u = u/λ² with u = 1 on the circle, so
/// u(0) = 1/I₀(ρ/λ)), at a uniformly distributed point of the circle (rotational symmetry). Within 0.1 nm of a wire it
/// is captured. A wire's ∫A dt is then (box area × covered time) × captured / launched, with Poisson noise
/// 1/√captured. I₀ from MathNet.Numerics.
/// </remarks>
public static class AdatomWalkSimulator
{
    private const double CaptureShellUm = 1e-4;

    /// <summary>
    /// Each wire's ∫A dt (µm²·s) over a history given as (λ in µm, seconds) pairs, launching
    /// <paramref name="adatoms"/> adatoms in the periodic box <paramref name="widthUm"/> × <paramref name="heightUm"/>.
    /// </summary>
    public static double[] Collect(ReadOnlySpan<Point2D> centresUm, ReadOnlySpan<double> radiiUm, double widthUm, double heightUm,
        ReadOnlySpan<double> lambdasUm, ReadOnlySpan<double> seconds, long adatoms, int seed)
    {
        double maxR = 0;
        foreach (double r in radiiUm)
        {
            maxR = Math.Max(maxR, r);
        }
        double totalS = 0;
        var cumulative = new double[seconds.Length];
        for (int b = 0; b < seconds.Length; b++)
        {
            totalS += seconds[b];
            cumulative[b] = totalS;
        }
        int n = centresUm.Length;
        double spacing = Math.Sqrt(widthUm * heightUm / Math.Max(n, 1));
        int bx = Math.Max(3, (int)(widthUm / Math.Max(spacing, 4 * maxR)));
        int by = Math.Max(3, (int)(heightUm / Math.Max(spacing, 4 * maxR)));
        double cw = widthUm / bx, ch = heightUm / by;
        double reach = Math.Min(cw, ch) - maxR;
        var buckets = new List<int>[bx * by];
        for (int k = 0; k < buckets.Length; k++)
        {
            buckets[k] = [];
        }
        var cx = new double[n];
        var cy = new double[n];
        var rr = new double[n];
        for (int i = 0; i < n; i++)
        {
            cx[i] = centresUm[i].X;
            cy[i] = centresUm[i].Y;
            rr[i] = radiiUm[i];
            buckets[(Math.Min((int)(cy[i] / ch), by - 1) * bx) + Math.Min((int)(cx[i] / cw), bx - 1)].Add(i);
        }
        int[][] table = buckets.Select(b => b.ToArray()).ToArray();
        var lambdas = lambdasUm.ToArray();
        var counts = new long[n];
        var random = new Xoshiro256StarStar(seed);
        for (long a = 0; a < adatoms; a++)
        {
            double pick = random.NextDouble() * totalS;
            int bin = Array.BinarySearch(cumulative, pick);
            bin = bin < 0 ? Math.Min(~bin, cumulative.Length - 1) : bin;
            double lambda = lambdas[bin];
            double x = random.NextDouble() * widthUm, y = random.NextDouble() * heightUm;
            while (true)
            {
                (int wire, double gap) = Nearest(x, y, cx, cy, rr, table, bx, by, cw, ch, widthUm, heightUm);
                if (gap <= CaptureShellUm)
                {
                    counts[wire]++;
                    break;
                }
                double rho = wire < 0 ? reach : Math.Min(gap, reach);
                if (random.NextDouble() * SpecialFunctions.BesselI0(rho / lambda) > 1.0)
                {
                    break;
                }
                double angle = random.NextDouble() * 2 * Math.PI;
                x += rho * Math.Cos(angle);
                y += rho * Math.Sin(angle);
                x -= widthUm * Math.Floor(x / widthUm);
                y -= heightUm * Math.Floor(y / heightUm);
            }
        }
        var integrals = new double[n];
        double scale = widthUm * heightUm * totalS / adatoms;
        for (int i = 0; i < n; i++)
        {
            integrals[i] = counts[i] * scale;
        }
        return integrals;
    }

    private static (int Wire, double Gap) Nearest(double x, double y, double[] cx, double[] cy, double[] rr, int[][] table,
        int bx, int by, double cw, double ch, double width, double height)
    {
        int ix = Math.Min((int)(x / cw), bx - 1), iy = Math.Min((int)(y / ch), by - 1);
        int best = -1;
        double bestGap = double.PositiveInfinity;
        for (int dy = -1; dy <= 1; dy++)
        {
            int jy = (iy + dy + by) % by;
            for (int dx = -1; dx <= 1; dx++)
            {
                int jx = (ix + dx + bx) % bx;
                foreach (int i in table[(jy * bx) + jx])
                {
                    double ox = x - cx[i], oy = y - cy[i];
                    ox -= width * Math.Round(ox / width);
                    oy -= height * Math.Round(oy / height);
                    double gap = Math.Sqrt((ox * ox) + (oy * oy)) - rr[i];
                    if (gap < bestGap)
                    {
                        bestGap = gap;
                        best = i;
                    }
                }
            }
        }
        return (best, bestGap);
    }
}
