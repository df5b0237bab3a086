using MathNet.Numerics;
using MathNet.Numerics.Random;
using RunWatch.Core.Geometry;

namespace RunWatch.Simulation.Growth;

/// <summary>
/// Monte Carlo of single adatoms on a periodic substrate with circular wires (perfect sinks), surface diffusion and
/// desorption, in continuous space: the demo's independent truth of what each wire collects. It shares no code with
/// Core's grid solver, capture tables or radius model.
/// </summary>
/// <remarks>
/// Each adatom lands at a uniform point at a uniform time of the history, so it carries that moment's λ, and only
/// wires that have nucleated by then are sinks. Landing on a footprint counts for that wire at once (the droplet
/// catches direct flux). Otherwise it moves by walk on spheres (Muller 1956, Ann. Math. Stat. 27, 569; FROM
/// MEMORY): in the largest disc of radius ρ around it that touches no wire, Brownian motion killed at rate 1/τ leaves
/// the disc before desorbing with probability E[e^(−T_exit/τ)] = 1/I₀(ρ/λ) (DERIVED: u(x) = E_x[e^(−T/τ)] solves
/// ∇²u = u/λ² with u = 1 on the circle, so u(0) = 1/I₀(ρ/λ)), at a uniformly distributed point of the circle
/// (rotational symmetry). Within <see cref="CaptureShellUm"/> of a wire it is caught. A wire's collected area-time is
/// (box area × history length) × caught ÷ launched, with Poisson noise 1/√caught. I₀ from MathNet.Numerics.
/// Sites are bucketed once; every array is allocated at construction, so a walk step allocates nothing.
/// </remarks>
public sealed class AdatomCollector
{
    /// <summary>Distance from a footprint at which an adatom counts as caught (µm): 0.1 nm.</summary>
    public const double CaptureShellUm = 1e-4;

    private readonly double _width, _height;
    private readonly double[] _x, _y, _r, _start;
    private readonly int _bx, _by;
    private readonly double _cw, _ch;
    private readonly int[] _bucketStart;
    private readonly int[] _bucketItems;
    private double _reach;

    /// <summary>Prepares a periodic box <paramref name="widthUm"/> × <paramref name="heightUm"/> with wires at <paramref name="sitesUm"/>.</summary>
    /// <param name="sitesUm">Wire centres inside the box (µm).</param>
    /// <param name="widthUm">Box width (µm).</param>
    /// <param name="heightUm">Box height (µm).</param>
    /// <param name="largestFootprintUm">Largest footprint radius any later call will use (sets the bucket size).</param>
    public AdatomCollector(ReadOnlySpan<Point2D> sitesUm, double widthUm, double heightUm, double largestFootprintUm)
    {
        if (!(widthUm > 0) || !(heightUm > 0) || !(largestFootprintUm > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(widthUm), "box sides and the largest footprint must be positive");
        }
        int n = sitesUm.Length;
        _width = widthUm;
        _height = heightUm;
        _x = new double[n];
        _y = new double[n];
        _r = new double[n];
        _start = new double[n];
        double spacing = Math.Sqrt(widthUm * heightUm / Math.Max(n, 1));
        double bucket = Math.Max(spacing, 4 * largestFootprintUm);
        _bx = Math.Max(3, (int)(widthUm / bucket));
        _by = Math.Max(3, (int)(heightUm / bucket));
        _cw = widthUm / _bx;
        _ch = heightUm / _by;
        var bucketOf = new int[n];
        _bucketStart = new int[(_bx * _by) + 1];
        for (int i = 0; i < n; i++)
        {
            double x = sitesUm[i].X - (widthUm * Math.Floor(sitesUm[i].X / widthUm));
            double y = sitesUm[i].Y - (heightUm * Math.Floor(sitesUm[i].Y / heightUm));
            _x[i] = x;
            _y[i] = y;
            bucketOf[i] = (Math.Min((int)(y / _ch), _by - 1) * _bx) + Math.Min((int)(x / _cw), _bx - 1);
            _bucketStart[bucketOf[i] + 1]++;
        }
        for (int b = 0; b < _bx * _by; b++)
        {
            _bucketStart[b + 1] += _bucketStart[b];
        }
        _bucketItems = new int[n];
        var fill = new int[_bx * _by];
        for (int i = 0; i < n; i++)
        {
            _bucketItems[_bucketStart[bucketOf[i]] + fill[bucketOf[i]]++] = i;
        }
    }

    /// <summary>Number of wires.</summary>
    public int WireCount => _x.Length;

    /// <summary>
    /// Launches <paramref name="adatoms"/> adatoms over the history slice and adds each wire's catch to
    /// <paramref name="caught"/>. Returns the number that desorbed.
    /// </summary>
    /// <param name="footprintsUm">Footprint radius of each wire in this slice (µm; not above the constructor's largest).</param>
    /// <param name="nucleationS">When each wire starts to be a sink (s on the history's axis).</param>
    /// <param name="history">The history.</param>
    /// <param name="fromS">Slice start (s).</param>
    /// <param name="toS">Slice end (s).</param>
    /// <param name="adatoms">Adatoms to launch.</param>
    /// <param name="seed">Seed of this call.</param>
    /// <param name="caught">Per-wire counts, added to.</param>
    public long Collect(ReadOnlySpan<double> footprintsUm, ReadOnlySpan<double> nucleationS, CaptureHistory history, double fromS, double toS,
        long adatoms, int seed, Span<long> caught)
    {
        ArgumentNullException.ThrowIfNull(history);
        if (footprintsUm.Length != WireCount || nucleationS.Length != WireCount || caught.Length != WireCount)
        {
            throw new ArgumentException("one footprint, nucleation time and count per wire");
        }
        double maxR = 0;
        for (int i = 0; i < WireCount; i++)
        {
            _r[i] = footprintsUm[i];
            _start[i] = nucleationS[i];
            maxR = Math.Max(maxR, footprintsUm[i]);
        }
        // Beyond the 3 × 3 buckets around a point every wire lies at least this far away.
        _reach = Math.Min(_cw, _ch) - maxR;
        if (!(_reach > 0))
        {
            throw new ArgumentException("a footprint exceeds the largest footprint given at construction", nameof(footprintsUm));
        }
        var random = new Xoshiro256StarStar(seed, threadSafe: false);
        long desorbed = 0;
        for (long a = 0; a < adatoms; a++)
        {
            double t = fromS + (random.NextDouble() * (toS - fromS));
            double lambda = history.CaptureLengthAt(t);
            double x = random.NextDouble() * _width, y = random.NextDouble() * _height;
            while (true)
            {
                int wire = Nearest(x, y, t, out double gap);
                if (wire >= 0 && gap <= CaptureShellUm)
                {
                    caught[wire]++;
                    break;
                }
                double rho = wire < 0 ? _reach : Math.Min(gap, _reach);
                if (Desorbs(random.NextDouble(), rho / lambda))
                {
                    desorbed++;
                    break;
                }
                double angle = random.NextDouble() * 2 * Math.PI;
                (double sin, double cos) = Math.SinCos(angle);
                x += rho * cos;
                y += rho * sin;
                x -= _width * Math.Floor(x / _width);
                y -= _height * Math.Floor(y / _height);
            }
        }
        return desorbed;
    }

    /// <summary>
    /// True when the adatom desorbs inside the disc: u·I₀(x) &gt; 1. I₀ is bracketed first by 1 + x²/4 ≤ I₀(x) ≤ e^(x²/4)
    /// (termwise from the series Σ (x²/4)^k/(k!)²), so the series is evaluated only when the bounds disagree.
    /// </summary>
    private static bool Desorbs(double u, double x)
    {
        double q = 0.25 * x * x;
        if (u * (1 + q) > 1.0)
        {
            return true;
        }
        if (u * Math.Exp(q) <= 1.0)
        {
            return false;
        }
        return u * SpecialFunctions.BesselI0(x) > 1.0;
    }

    /// <summary>Nearest wire nucleated by <paramref name="t"/> within the 3 × 3 buckets around (x, y), or −1.</summary>
    private int Nearest(double x, double y, double t, out double bestGap)
    {
        int ix = Math.Min((int)(x / _cw), _bx - 1), iy = Math.Min((int)(y / _ch), _by - 1);
        int best = -1;
        bestGap = double.PositiveInfinity;
        for (int dy = -1; dy <= 1; dy++)
        {
            int jy = (iy + dy + _by) % _by;
            for (int dx = -1; dx <= 1; dx++)
            {
                int b = (jy * _bx) + ((ix + dx + _bx) % _bx);
                for (int k = _bucketStart[b]; k < _bucketStart[b + 1]; k++)
                {
                    int i = _bucketItems[k];
                    if (_start[i] > t)
                    {
                        continue;
                    }
                    double ox = x - _x[i], oy = y - _y[i];
                    ox -= _width * Math.Round(ox / _width);
                    oy -= _height * Math.Round(oy / _height);
                    double gap = Math.Sqrt((ox * ox) + (oy * oy)) - _r[i];
                    if (gap < bestGap)
                    {
                        bestGap = gap;
                        best = i;
                    }
                }
            }
        }
        return best;
    }
}
