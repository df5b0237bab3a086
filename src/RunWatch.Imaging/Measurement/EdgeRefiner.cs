namespace RunWatch.Imaging.Measurement;

/// <summary>
/// Locates an object's edge to a fraction of a pixel: <see cref="Rays"/> rays from the centroid sample the decoded
/// image (bilinear, every ¼ px) across the threshold outline. The object's levels come from all rays together (the
/// local substrate 2.5–4.5 px outside the outline, the peak of the mean edge profile at the edge, rims included), so
/// noise in one ray does not move them; each ray's edge is where its profile crosses half-way between substrate and
/// peak (average of the first crossing from inside and the last from outside). For a Gaussian-blurred step the
/// half-maximum lies on the edge (erf profile; DERIVED). Rays that run into another object are left out (touching
/// wires, split cuts). Rays are spaced evenly in the sample plane: with a stage tilt θ about x, a ray of sample-plane
/// direction ψ runs along (cos ψ, cos θ·sin ψ) in the image, so radii and shapes come out corrected for foreshortening.
/// One instance per thread; buffers are reused.
/// </summary>
internal sealed class EdgeRefiner
{
    public const int Rays = 48;
    private const double Step = 0.25;
    private const double OutsideReach = 4.5;
    private const double SubstrateFrom = 2.5;
    /// <summary>Samples of the mean edge profile: u = −3 … +3 px around the located edges, ¼ px apart.</summary>
    public const int Bins = 25;
    public const int BinZero = 12;
    public const double BinStep = Step;

    private static readonly double[] Cos = Enumerable.Range(0, Rays).Select(k => Math.Cos(2 * Math.PI * k / Rays)).ToArray();
    private static readonly double[] Sin = Enumerable.Range(0, Rays).Select(k => Math.Sin(2 * Math.PI * k / Rays)).ToArray();

    private float[] _samples = [];
    private int _stride;
    private readonly int[] _length = new int[Rays];
    private readonly int[] _first = new int[Rays];
    private readonly byte[] _state = new byte[Rays];
    private readonly double[] _edge = new double[Rays];
    private readonly double[] _mean = new double[Bins];
    private readonly int[] _count = new int[Bins];
    private double[] _pool = [];

    private const byte Clean = 0;
    private const byte Blocked = 1;
    private const byte Lost = 2;
    private const byte Crowded = 3;

    /// <summary>Measures the edge of <paramref name="wire"/> (label image already final) in rows [<paramref name="rowStart"/>, <paramref name="rowEnd"/>).</summary>
    /// <param name="image">Decoded pixels.</param>
    /// <param name="labels">Final object ids per pixel.</param>
    /// <param name="width">Image width.</param>
    /// <param name="rowStart">First analysed row.</param>
    /// <param name="rowEnd">One past the last analysed row.</param>
    /// <param name="wire">The object.</param>
    /// <param name="cosTilt">cos of the stage tilt (1 for a top-down view).</param>
    /// <param name="alignedProfile"><see cref="Bins"/> values: the mean profile aligned on the located edges, as (level − substrate)/(peak − substrate); NaN where not measured.</param>
    public EdgeProfile Measure(ushort[] image, int[] labels, int width, int rowStart, int rowEnd, in RawWire wire, double cosTilt, Span<double> alignedProfile)
    {
        alignedProfile.Fill(double.NaN);
        double reach = (wire.MaxFeret / Math.Max(0.1, cosTilt)) + OutsideReach + 2;
        int stride = (int)Math.Ceiling(reach / Step) + 2;
        if (_samples.Length < Rays * stride)
        {
            _samples = new float[Rays * stride * 2];
            _pool = new double[Rays * stride * 2];
        }
        _stride = stride;
        Sample(image, labels, width, rowStart, rowEnd, wire, cosTilt, stride);

        var result = new EdgeProfile();
        int pooled = 0;
        for (int k = 0; k < Rays; k++)
        {
            if (_state[k] != Clean)
            {
                result.BlockedRays += _state[k] == Blocked ? 1 : 0;
                continue;
            }
            int from = _first[k] + (int)(SubstrateFrom / Step);
            for (int s = from; s < _length[k]; s++)
            {
                _pool[pooled++] = _samples[(k * stride) + s];
            }
        }
        if (pooled < 8)
        {
            return result;
        }
        result.Substrate = Median(_pool.AsSpan(0, pooled));
        pooled = 0;
        for (int k = 0; k < Rays; k++)
        {
            if (_state[k] is Clean or Crowded)
            {
                int end = (int)(0.4 * _first[k]);
                for (int s = 0; s <= end; s++)
                {
                    _pool[pooled++] = _samples[(k * stride) + s];
                }
            }
        }
        result.Centre = pooled > 0 ? Median(_pool.AsSpan(0, pooled)) : double.NaN;

        // Levels from the mean profile aligned on the threshold outline; then each ray's half-level crossing.
        MeanProfile(k => _first[k]);
        double top = Peak();
        double level = 0.5 * (result.Substrate + top);
        int valid = 0;
        double sumR2 = 0;
        for (int k = 0; k < Rays; k++)
        {
            _edge[k] = double.NaN;
            if (_state[k] is Clean or Crowded && Crossing(k, level, out double t))
            {
                _edge[k] = t;
                sumR2 += t * t;
                valid++;
            }
        }
        result.ValidRays = valid;
        result.Top = top;
        if (valid < 6)
        {
            return result;
        }
        // ½∮r²dφ as a Riemann sum over the rays that were located.
        result.HalfLevelArea = Math.PI * sumR2 / valid;

        // Edge width from the mean profile aligned on the located edges: σ = u(15.87 %) − u(50 %) on the outer flank (erf).
        MeanProfile(k => double.IsNaN(_edge[k]) ? -1 : _edge[k] / Step);
        double peak = Peak();
        result.EdgeSigma = FlankWidth(result.Substrate, peak);
        if (peak > result.Substrate)
        {
            for (int b = 0; b < Bins; b++)
            {
                alignedProfile[b] = (_mean[b] - result.Substrate) / (peak - result.Substrate);
            }
        }
        (result.Irregularity, result.SixFold, result.RayAspect) = Shape();
        result.CoreRadius = Core(result, top);
        return result;
    }

    private ushort[] _patchImage = [];
    private int[] _patchLabels = [];

    private void Sample(ushort[] fullImage, int[] fullLabels, int fullWidth, int fullRowStart, int fullRowEnd, in RawWire wire, double cosTilt, int stride)
    {
        // Copy the object's neighbourhood once (row by row): rays then read a small cache-resident patch instead of
        // striding through the whole image's rows.
        double reach = (stride + 1) * Step;
        int px0 = Math.Max(0, (int)Math.Floor(wire.CentroidX - reach) - 1), px1 = Math.Min(fullWidth - 1, (int)Math.Ceiling(wire.CentroidX + reach) + 1);
        int py0 = Math.Max(fullRowStart, (int)Math.Floor(wire.CentroidY - reach) - 1), py1 = Math.Min(fullRowEnd - 1, (int)Math.Ceiling(wire.CentroidY + reach) + 1);
        int width = px1 - px0 + 1, rows = py1 - py0 + 1;
        if (_patchImage.Length < width * rows)
        {
            _patchImage = new ushort[width * rows * 2];
            _patchLabels = new int[width * rows * 2];
        }
        for (int y = 0; y < rows; y++)
        {
            Array.Copy(fullImage, ((py0 + y) * fullWidth) + px0, _patchImage, y * width, width);
            Array.Copy(fullLabels, ((py0 + y) * fullWidth) + px0, _patchLabels, y * width, width);
        }
        ushort[] image = _patchImage;
        int[] labels = _patchLabels;
        // Patch coordinates; the patch's rows stand for [py0, py1] and its edges are the image's or beyond every ray's reach.
        int rowStart = 0, rowEnd = rows;
        int label = wire.Label;
        double cx = wire.CentroidX - px0, cy = wire.CentroidY - py0;
        int outside = (int)(OutsideReach / Step);
        for (int k = 0; k < Rays; k++)
        {
            double dx = Cos[k], dy = Sin[k] * cosTilt;
            int n = 0;
            int first = -1;
            byte state = Lost;
            for (int s = 0; s < stride; s++)
            {
                double t = s * Step;
                double x = cx + (t * dx), y = cy + (t * dy);
                if (x < 0 || y < rowStart || x >= width || y >= rowEnd)
                {
                    state = Lost;
                    break;
                }
                int at = labels[((int)y * width) + (int)x];
                if (first < 0 && at != label)
                {
                    if (at != 0)
                    {
                        state = Blocked;
                        break;
                    }
                    first = s;
                }
                else if (first >= 0 && at != 0 && at != label)
                {
                    state = Crowded;
                    break;
                }
                _samples[(k * stride) + n++] = Bilinear(image, width, rowStart, rowEnd, x - 0.5, y - 0.5);
                if (first >= 0 && s >= first + outside)
                {
                    state = Clean;
                    break;
                }
            }
            _state[k] = first >= 0 && (state == Clean || (state == Crowded && n > first + (int)(1.5 / Step))) ? state : state == Blocked ? Blocked : Lost;
            _length[k] = n;
            _first[k] = first;
        }
    }

    private static float Bilinear(ushort[] image, int width, int rowStart, int rowEnd, double x, double y)
    {
        x = Math.Clamp(x, 0, width - 1.000001);
        y = Math.Clamp(y, rowStart, rowEnd - 1.000001);
        int x0 = (int)x, y0 = (int)y;
        int x1 = Math.Min(width - 1, x0 + 1), y1 = Math.Min(rowEnd - 1, y0 + 1);
        double fx = x - x0, fy = y - y0;
        double top = (image[(y0 * width) + x0] * (1 - fx)) + (image[(y0 * width) + x1] * fx);
        double bottom = (image[(y1 * width) + x0] * (1 - fx)) + (image[(y1 * width) + x1] * fx);
        return (float)((top * (1 - fy)) + (bottom * fy));
    }

    /// <summary>Mean of the usable rays' profiles around an anchor (sample index, fractional allowed; negative = skip).</summary>
    private void MeanProfile(Func<int, double> anchor)
    {
        Array.Clear(_mean);
        Array.Clear(_count);
        for (int k = 0; k < Rays; k++)
        {
            if (_state[k] is not (Clean or Crowded))
            {
                continue;
            }
            double a = anchor(k);
            if (a < 0)
            {
                continue;
            }
            for (int b = 0; b < Bins; b++)
            {
                double s = a + b - BinZero;
                int i = (int)Math.Floor(s);
                if (i < 0 || i + 1 >= _length[k])
                {
                    continue;
                }
                double f = s - i;
                _mean[b] += (_samples[(k * _stride) + i] * (1 - f)) + (_samples[(k * _stride) + i + 1] * f);
                _count[b]++;
            }
        }
        for (int b = 0; b < Bins; b++)
        {
            _mean[b] = _count[b] > 0 ? _mean[b] / _count[b] : double.NaN;
        }
    }

    /// <summary>Highest mean level from 1½ px inside to ½ px outside the anchor (the rim, not a droplet further in).</summary>
    private double Peak()
    {
        double best = double.NegativeInfinity;
        for (int b = BinZero - 6; b <= BinZero + 2; b++)
        {
            if (!double.IsNaN(_mean[b]) && _mean[b] > best)
            {
                best = _mean[b];
            }
        }
        return best;
    }

    private double FlankWidth(double substrate, double peak)
    {
        double step = peak - substrate;
        if (!(step > 0))
        {
            return double.NaN;
        }
        double u50 = double.NaN, u16 = double.NaN;
        for (int b = BinZero - 8; b < Bins - 1; b++)
        {
            double f0 = (_mean[b] - substrate) / step, f1 = (_mean[b + 1] - substrate) / step;
            if (double.IsNaN(u50) && f0 >= 0.5 && f1 < 0.5)
            {
                u50 = (b + ((f0 - 0.5) / (f0 - f1))) * Step;
            }
            if (!double.IsNaN(u50) && f0 >= 0.15866 && f1 < 0.15866)
            {
                u16 = (b + ((f0 - 0.15866) / (f0 - f1))) * Step;
                break;
            }
        }
        return u16 - u50;
    }

    private bool Crossing(int k, double level, out double t)
    {
        t = double.NaN;
        int offset = k * _stride;
        int anchor = _first[k];
        int lo = Math.Max(0, anchor - (int)(2 / Step));
        int hi = Math.Min(_length[k] - 1, anchor + (int)(2.5 / Step));
        if (hi <= lo || _samples[offset + hi] >= level)
        {
            return false;
        }
        int peakAt = lo;
        for (int s = lo; s <= Math.Min(hi, anchor + 2); s++)
        {
            if (_samples[offset + s] > _samples[offset + peakAt])
            {
                peakAt = s;
            }
        }
        if (_samples[offset + peakAt] < level)
        {
            return false;
        }
        double inner = double.NaN, outer = double.NaN;
        for (int s = peakAt; s < hi; s++)
        {
            if (_samples[offset + s + 1] < level)
            {
                inner = Between(offset, s, level);
                break;
            }
        }
        for (int s = hi - 1; s >= peakAt; s--)
        {
            if (_samples[offset + s] >= level)
            {
                outer = Between(offset, s, level);
                break;
            }
        }
        t = 0.5 * (inner + outer);
        return !double.IsNaN(t);
    }

    private double Between(int offset, int s, double level)
    {
        double a = _samples[offset + s], b = _samples[offset + s + 1];
        return (s + ((a - level) / (a - b))) * Step;
    }

    /// <summary>Harmonics 2–5 of the edge radius (a hexagon has only 6, 12, …; 1 is an off-centre origin) and the ray aspect.</summary>
    private (double Irregularity, double SixFold, double Aspect) Shape()
    {
        double total = 0;
        int n = 0;
        for (int k = 0; k < Rays; k++)
        {
            if (!double.IsNaN(_edge[k]))
            {
                total += _edge[k];
                n++;
            }
        }
        double irregular = double.NaN, six = double.NaN;
        if (n >= Rays - 6)
        {
            double mean = total / n, sum2 = 0;
            for (int m = 2; m <= 6; m++)
            {
                double re = 0, im = 0;
                for (int k = 0; k < Rays; k++)
                {
                    if (!double.IsNaN(_edge[k]))
                    {
                        int phase = (m * k) % Rays;
                        re += (_edge[k] - mean) * Cos[phase];
                        im -= (_edge[k] - mean) * Sin[phase];
                    }
                }
                double power = ((re * re) + (im * im)) / ((double)n * n);
                if (m == 6)
                {
                    six = 2 * Math.Sqrt(power) / mean;
                }
                else
                {
                    sum2 += power;
                }
            }
            irregular = 2 * Math.Sqrt(sum2) / mean;
        }
        else if (n >= 0.6 * Rays)
        {
            (irregular, six) = GappedHarmonics(n);
        }
        double lo = double.PositiveInfinity, hi = 0;
        int pairs = 0;
        for (int k = 0; k < Rays / 2; k++)
        {
            double d = _edge[k] + _edge[k + (Rays / 2)];
            if (!double.IsNaN(d))
            {
                lo = Math.Min(lo, d);
                hi = Math.Max(hi, d);
                pairs++;
            }
        }
        return (irregular, six, pairs >= 8 ? hi / lo : double.NaN);
    }

    /// <summary>
    /// With rays missing (a split piece's cut) the sums above are not orthogonal: least squares of r(φ) on harmonics
    /// 0–6 over the located rays instead (MathNet QR), so the missing sector adds no false irregularity.
    /// </summary>
    private (double Irregularity, double SixFold) GappedHarmonics(int n)
    {
        const int Terms = 13;
        var design = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(n, Terms);
        var target = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(n);
        int row = 0;
        for (int k = 0; k < Rays; k++)
        {
            if (double.IsNaN(_edge[k]))
            {
                continue;
            }
            design[row, 0] = 1;
            for (int m = 1; m <= 6; m++)
            {
                design[row, (2 * m) - 1] = Cos[(m * k) % Rays];
                design[row, 2 * m] = Sin[(m * k) % Rays];
            }
            target[row++] = _edge[k];
        }
        var c = design.QR().Solve(target);
        double mean = c[0], sum2 = 0;
        for (int m = 2; m <= 5; m++)
        {
            sum2 += (c[(2 * m) - 1] * c[(2 * m) - 1]) + (c[2 * m] * c[2 * m]);
        }
        double six = Math.Sqrt((c[11] * c[11]) + (c[12] * c[12]));
        return (Math.Sqrt(sum2) / mean, six / mean);
    }

    /// <summary>A core brighter than the edge peak (a droplet on the top): its radius at half-way between centre and edge peak, from the rays' first drop.</summary>
    private double Core(in EdgeProfile p, double top)
    {
        double contrast = top - p.Substrate;
        if (!(p.Centre - top > 0.25 * contrast))
        {
            return 0;
        }
        double level = 0.5 * (p.Centre + top);
        double sum2 = 0;
        int n = 0;
        for (int k = 0; k < Rays; k++)
        {
            if (double.IsNaN(_edge[k]))
            {
                continue;
            }
            int offset = k * _stride;
            int end = (int)(_edge[k] / Step);
            for (int s = 0; s < end && s + 1 < _length[k]; s++)
            {
                if (_samples[offset + s] >= level && _samples[offset + s + 1] < level)
                {
                    double r = Between(offset, s, level);
                    sum2 += r * r;
                    n++;
                    break;
                }
            }
        }
        return n >= Rays / 2 ? Math.Sqrt(sum2 / n) : 0;
    }

    /// <summary>Median by selection (Hoare's quickselect, expected linear time; reorders <paramref name="values"/>).</summary>
    private static double Median(Span<double> values)
    {
        int n = values.Length;
        double upper = Select(values, n / 2);
        if (n % 2 == 1)
        {
            return upper;
        }
        // After selecting n/2, the lower half holds the smaller values: the other middle value is its maximum.
        double lower = double.NegativeInfinity;
        for (int i = 0; i < n / 2; i++)
        {
            lower = Math.Max(lower, values[i]);
        }
        return 0.5 * (lower + upper);
    }

    private static double Select(Span<double> a, int k)
    {
        int lo = 0, hi = a.Length - 1;
        while (lo < hi)
        {
            double pivot = a[lo + ((hi - lo) / 2)];
            int i = lo, j = hi;
            while (i <= j)
            {
                while (a[i] < pivot)
                {
                    i++;
                }
                while (a[j] > pivot)
                {
                    j--;
                }
                if (i <= j)
                {
                    (a[i], a[j]) = (a[j], a[i]);
                    i++;
                    j--;
                }
            }
            if (k <= j)
            {
                hi = j;
            }
            else if (k >= i)
            {
                lo = i;
            }
            else
            {
                return a[k];
            }
        }
        return a[k];
    }
}
