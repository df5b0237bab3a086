using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

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
    /// <summary>Located rays an object needs for its shape features and to serve as a reference (5/6 of <see cref="Rays"/>).</summary>
    public const int MostRays = Rays - (Rays / 6);
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
    /// <summary>First sample index filled per ray: only the window around the outline is sampled (the inside on demand, for a droplet core).</summary>
    private readonly int[] _start = new int[Rays];
    private readonly double[] _anchor = new double[Rays];
    private double _cx;
    private double _cy;
    private double _cosTilt;
    private int _patchWidth;
    private int _patchRows;
    private bool _interior;
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
            // Every other sample (½ px apart; the blur correlates neighbours anyway).
            int from = _first[k] + (int)(SubstrateFrom / Step);
            ReadOnlySpan<float> ray = _samples.AsSpan(k * stride, _length[k]);
            for (int s = from; s < ray.Length; s += 2)
            {
                _pool[pooled++] = ray[s];
            }
        }
        if (pooled < 8)
        {
            return result;
        }
        result.Substrate = Median(_pool.AsSpan(0, pooled));
        result.Centre = InnerMedian();

        // Levels from the mean profile aligned on the threshold outline; then each ray's half-level crossing.
        for (int k = 0; k < Rays; k++)
        {
            _anchor[k] = _first[k];
        }
        // Only the bins the peak search reads.
        MeanProfile(BinZero - 6, BinZero + 3, 1);
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
        if (valid < Rays / 8)
        {
            return result;
        }
        // ½∮r²dφ as a Riemann sum over the rays that were located.
        result.HalfLevelArea = Math.PI * sumR2 / valid;

        // Edge width from the mean profile aligned on the located edges: σ = u(15.87 %) − u(50 %) on the outer flank (erf).
        for (int k = 0; k < Rays; k++)
        {
            _anchor[k] = double.IsNaN(_edge[k]) ? -1 : _edge[k] / Step;
        }
        // Every other ray carries the full window: half the rays describe the profile's shape as well (it is a mean).
        MeanProfile(0, Bins, 2);
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
        // striding through the whole image's rows. A ray stops 4½ px (sample plane; less in the image) after it
        // leaves the object, so the bounding box and a 6 px margin hold every sample; only the image's border cuts it.
        const int Margin = 6;
        int px0 = Math.Max(0, wire.MinX - Margin), px1 = Math.Min(fullWidth - 1, wire.MaxX + Margin);
        int py0 = Math.Max(fullRowStart, wire.MinY - Margin), py1 = Math.Min(fullRowEnd - 1, wire.MaxY + Margin);
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
        ReadOnlySpan<int> labels = _patchLabels.AsSpan(0, width * rows);
        int label = wire.Label;
        double cx = wire.CentroidX - px0, cy = wire.CentroidY - py0;
        _cx = cx;
        _cy = cy;
        _cosTilt = cosTilt;
        _patchWidth = width;
        _patchRows = rows;
        _interior = px0 > 0 && py0 > fullRowStart && px1 < fullWidth - 1 && py1 < fullRowEnd - 1;
        int outside = (int)(OutsideReach / Step);
        for (int k = 0; k < Rays; k++)
        {
            // The walk reads labels only; the image is sampled afterwards, in the window the edge step uses.
            double dx = Cos[k] * Step, dy = Sin[k] * cosTilt * Step;
            int first = -1;
            byte state = Lost;
            int n = 0;
            // Inside the object: ½ px strides (a feature narrower than that does not end the object), then back to
            // the first ¼ px sample that left it.
            int s = 0;
            int at = LabelAt(labels, width, rows, cx, cy);
            while (at == label)
            {
                int next = s + 2;
                if (next >= stride || LabelAt(labels, width, rows, cx + (next * dx), cy + (next * dy)) != label)
                {
                    // Resolve the stride sample by sample.
                    for (s++; s <= Math.Min(next, stride - 1); s++)
                    {
                        at = LabelAt(labels, width, rows, cx + (s * dx), cy + (s * dy));
                        if (at != label)
                        {
                            break;
                        }
                    }
                    break;
                }
                s = next;
            }
            if (s >= stride || at == label)
            {
                state = Lost;
                n = Math.Min(s, stride);
            }
            else if (at == OutsidePatch)
            {
                state = Lost;
                n = s;
            }
            else if (at != 0)
            {
                state = Blocked;
                n = s;
            }
            else
            {
                first = s;
                int end = Math.Min(stride - 1, first + outside);
                state = Clean;
                n = end + 1;
                // Outside: another object within reach crowds the ray; the samples stop before it.
                // ½ px strides; a hit is resolved to the first ¼ px sample that shows it.
                for (int t = first + 2; t - 1 <= end; t += 2)
                {
                    int probe = Math.Min(t, end);
                    int there = LabelAt(labels, width, rows, cx + (probe * dx), cy + (probe * dy));
                    if (there != OutsidePatch && (there == 0 || there == label))
                    {
                        continue;
                    }
                    if (probe - 1 > first)
                    {
                        int before = LabelAt(labels, width, rows, cx + ((probe - 1) * dx), cy + ((probe - 1) * dy));
                        if (before == OutsidePatch || (before != 0 && before != label))
                        {
                            probe--;
                            there = before;
                        }
                    }
                    state = there == OutsidePatch ? Lost : Crowded;
                    n = probe;
                    break;
                }
                if (state == Clean && end < first + outside)
                {
                    state = Lost;
                }
            }
            _state[k] = first >= 0 && (state == Clean || (state == Crowded && n > first + (int)(1.5 / Step))) ? state : state == Blocked ? Blocked : Lost;
            _length[k] = n;
            _first[k] = first;
            _start[k] = n;
            if (_state[k] is Clean or Crowded)
            {
                if (k % 2 == 0)
                {
                    // Even rays: the whole window (the mean profile's shape, rims and flank).
                    int from = Math.Max(0, first - Window);
                    SampleRange(k, from, n, 1);
                    _start[k] = from;
                }
                else
                {
                    // Odd rays: what the crossing reads (2 px inside to 2½ px outside) and the substrate's samples (every other).
                    int from = Math.Max(0, first - CrossingInside);
                    int crossingEnd = Math.Min(n, first + CrossingOutside + 1);
                    SampleRange(k, from, crossingEnd, 1);
                    int substrate = first + (int)(SubstrateFrom / Step);
                    if (substrate < n)
                    {
                        SampleRange(k, substrate, n, 2);
                    }
                    _start[k] = from;
                }
            }
        }
    }

    private const int OutsidePatch = -1;

    /// <summary>The label under a sample point (patch coordinates), or <see cref="OutsidePatch"/>.</summary>
    private static int LabelAt(ReadOnlySpan<int> labels, int width, int rows, double x, double y) =>
        x >= 0 && y >= 0 && x < width && y < rows ? labels[((int)y * width) + (int)x] : OutsidePatch;

    /// <summary>Samples kept inside the outline per ray: 4¼ px, enough for the mean profile around an edge found up to 1 px inside it.</summary>
    private const int Window = 17;

    /// <summary>The crossing's search window around the outline, in samples: 2 px inside, 2½ px outside.</summary>
    private const int CrossingInside = 8;
    private const int CrossingOutside = 10;

    /// <summary>Bilinear samples [<paramref name="from"/>, <paramref name="to"/>) of ray <paramref name="k"/> into its row of the sample table.</summary>
    private void SampleRange(int k, int from, int to, int step)
    {
        ReadOnlySpan<ushort> image = _patchImage.AsSpan(0, _patchWidth * _patchRows);
        Span<float> ray = _samples.AsSpan(k * _stride, to);
        int width = _patchWidth;
        float dx = (float)(Cos[k] * Step), dy = (float)(Sin[k] * _cosTilt * Step);
        // Pixel centres sit at +½: sample coordinates shifted by −½.
        float ox = (float)(_cx - 0.5), oy = (float)(_cy - 0.5);
        if (_interior)
        {
            // The patch has its full margin on every side: every sample and its 2 × 2 neighbours lie inside it, so the
            // reads skip the bounds checks (the hot loop of the edge step).
            ref ushort origin = ref MemoryMarshal.GetArrayDataReference(_patchImage);
            ref float target = ref MemoryMarshal.GetReference(ray);
            for (int s = from; s < to; s += step)
            {
                float x = ox + (s * dx), y = oy + (s * dy);
                int x0 = (int)x, y0 = (int)y;
                float fx = x - x0, fy = y - y0;
                ref ushort p = ref Unsafe.Add(ref origin, (y0 * width) + x0);
                float p00 = p, p01 = Unsafe.Add(ref p, 1), p10 = Unsafe.Add(ref p, width), p11 = Unsafe.Add(ref p, width + 1);
                float upper = p00 + (fx * (p01 - p00));
                float lower = p10 + (fx * (p11 - p10));
                Unsafe.Add(ref target, s) = upper + (fy * (lower - upper));
            }
            return;
        }
        float xMax = width - 1.0001f, yMax = _patchRows - 1.0001f;
        for (int s = from; s < to; s += step)
        {
            // At the image's border the patch is cut: clamp, as the edge pixels continue outwards.
            float x = Math.Clamp(ox + (s * dx), 0, xMax), y = Math.Clamp(oy + (s * dy), 0, yMax);
            int x0 = (int)x, y0 = (int)y;
            int at = (y0 * width) + x0;
            float fx = x - x0, fy = y - y0;
            float upper = image[at] + (fx * (image[at + 1] - image[at]));
            float lower = image[at + width] + (fx * (image[at + width + 1] - image[at + width]));
            ray[s] = upper + (fy * (lower - upper));
        }
    }

    /// <summary>Median level over the inner 40 % of the usable rays, sampled every pixel (a droplet raises it).</summary>
    private double InnerMedian()
    {
        int pooled = 0;
        bool centre = false;
        for (int k = 0; k < Rays; k++)
        {
            if (_state[k] is not (Clean or Crowded))
            {
                continue;
            }
            int end = (int)(0.4 * _first[k]);
            // Every 4th sample (1 px apart); the centre itself once.
            for (int s = centre ? 4 : 0; s <= end; s += 4)
            {
                if (s < _start[k])
                {
                    SampleRange(k, s, s + 1, 1);
                }
                _pool[pooled++] = _samples[(k * _stride) + s];
            }
            centre = true;
        }
        return pooled > 0 ? Median(_pool.AsSpan(0, pooled)) : double.NaN;
    }

    /// <summary>Fills the inside of ray <paramref name="k"/> (the droplet core needs the profile from the centre).</summary>
    private void EnsureInside(int k)
    {
        if (_start[k] > 0)
        {
            SampleRange(k, 0, _start[k], 1);
            _start[k] = 0;
        }
    }

    /// <summary>Mean of the usable rays' profiles around each ray's anchor in <see cref="_anchor"/> (sample index, fractional allowed; negative = skip).</summary>
    private void MeanProfile(int binFrom, int binTo, int rayStep)
    {
        Span<double> mean = _mean;
        Span<int> count = _count;
        mean.Clear();
        count.Clear();
        for (int k = 0; k < Rays; k += rayStep)
        {
            double a = _anchor[k];
            if (_state[k] is not (Clean or Crowded) || a < 0)
            {
                continue;
            }
            ReadOnlySpan<float> ray = _samples.AsSpan(k * _stride, _length[k]);
            double floor = Math.Floor(a);
            int i0 = (int)floor - BinZero;
            double f = a - floor, g = 1 - f;
            int bFrom = Math.Max(binFrom, _start[k] - i0), bTo = Math.Min(binTo, ray.Length - 1 - i0);
            for (int b = bFrom; b < bTo; b++)
            {
                int i = i0 + b;
                mean[b] += (ray[i] * g) + (ray[i + 1] * f);
                count[b]++;
            }
        }
        for (int b = 0; b < Bins; b++)
        {
            mean[b] = count[b] > 0 ? mean[b] / count[b] : double.NaN;
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
        int lo = Math.Max(_start[k], anchor - CrossingInside);
        int hi = Math.Min(_length[k] - 1, anchor + CrossingOutside);
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
        if (n >= Rays - (Rays / 8))
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
        return (irregular, six, pairs >= Rays / 6 ? hi / lo : double.NaN);
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
        // The even rays (half of them, evenly spaced) describe a disc well enough; the odd ones are not sampled inside.
        for (int k = 0; k < Rays; k += 2)
        {
            if (double.IsNaN(_edge[k]))
            {
                continue;
            }
            EnsureInside(k);
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
        return n >= Rays / 4 ? Math.Sqrt(sum2 / n) : 0;
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
