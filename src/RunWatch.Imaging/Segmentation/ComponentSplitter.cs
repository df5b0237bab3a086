using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Splits one connected component into wires and measures each. Markers are the h-maxima of the distance
/// transform inside the component (Soille, P. (2003) "Morphological Image Analysis", 2nd ed., §6.3): pixels are
/// flooded in decreasing distance order (watershed by immersion, Vincent, L. &amp; Soille, P. (1991) IEEE PAMI
/// 13(6), 583–598) with a union-find forest; when two basins meet, the one whose peak rises less than h above
/// the meeting level is absorbed, otherwise both are kept as separate wires. Compact components (area close to
/// the disc of their largest inscribed radius) cannot hold two significant peaks and skip the flooding.
/// One instance per thread; buffers grow to the largest component seen and are reused.
/// </summary>
internal sealed class ComponentSplitter(double hMaximaPixels, double compactFactor, int maxHolePixels = 0, double notchDepthPixels = 0)
{
    private readonly NotchSplitter _notches = new();
    private int[] _queue = [];
    private static readonly (int Dx, int Dy)[] Neighbours8 = [(-1, -1), (0, -1), (1, -1), (-1, 0), (1, 0), (-1, 1), (0, 1), (1, 1)];

    private int[] _features = [];
    private int[] _distance2 = [];
    private int[] _nearestRow = [];
    private int[] _column = [];
    private DistanceTransform.RowScratch _rowScratch = new(1);
    private int[] _parent = [];
    private int[] _peak = [];
    private bool[] _significant = [];
    private int[] _order = [];
    private int[] _keys = [];
    private int[] _piece = [];
    private int[] _rootPiece = [];
    private int[] _rowMin = [];
    private int[] _rowMax = [];
    private (int X, int Y)[] _points = [];
    private (int X, int Y)[] _hull = [];
    private long[] _sums = [];

    /// <summary>
    /// Splits component <paramref name="label"/> and appends one <see cref="RawWire"/> per piece to <paramref name="output"/>.
    /// Returns the piece map (patch-local piece index + 1, patch = box padded by one pixel) when the component was split, else null.
    /// </summary>
    public int[]? Process(int[] labels, ushort[] intensity, int width, int label, in ComponentBox box, List<RawWire> output)
    {
        int pw = box.Width + 2;
        int ph = box.Height + 2;
        int n = pw * ph;
        EnsureCapacity(n, pw, ph);
        int[] feat = _features;
        Array.Fill(feat, 1, 0, n);
        for (int y = box.MinY; y <= box.MaxY; y++)
        {
            int src = y * width;
            int dst = (y - box.MinY + 1) * pw + 1 - box.MinX;
            for (int x = box.MinX; x <= box.MaxX; x++)
            {
                if (labels[src + x] == label)
                {
                    feat[dst + x] = 0;
                }
            }
        }

        int area = box.Area + (maxHolePixels > 0 ? FillHoles(labels, width, label, box, pw, ph) : 0);

        int pieces = 1;
        Array.Fill(_piece, 0, 0, n);
        if (area >= 8 && box.Width >= 3 && box.Height >= 3)
        {
            DistanceTransform.ComputeDistance2(feat, pw, ph, _distance2, _nearestRow, _rowScratch, _column);
            int max2 = 0;
            for (int i = 0; i < n; i++)
            {
                if (feat[i] == 0 && _distance2[i] > max2)
                {
                    max2 = _distance2[i];
                }
            }
            double inscribed = Math.Sqrt(max2);
            if (area > compactFactor * Math.PI * inscribed * inscribed)
            {
                pieces = Flood(pw, n);
            }
            if (notchDepthPixels > 0)
            {
                pieces = _notches.Split(_features, _piece, pw, ph, pieces, notchDepthPixels);
            }
        }
        Measure(intensity, width, label, box, pw, ph, pieces, output);
        if (pieces == 1)
        {
            return null;
        }
        var map = new int[n];
        for (int i = 0; i < n; i++)
        {
            map[i] = feat[i] == 0 ? _piece[i] + 1 : 0;
        }
        return map;
    }

    /// <summary>
    /// Background pixels of the box that the outside cannot reach (4-connected) are holes: a wire top whose interior
    /// fell below the threshold while its bright rim stayed above it. Holes up to the size limit join the component,
    /// in the patch and in the label image; returns the pixels added.
    /// </summary>
    private int FillHoles(int[] labels, int width, int label, in ComponentBox box, int pw, int ph)
    {
        int n = pw * ph;
        if (_queue.Length < n)
        {
            _queue = new int[Math.Max(n, _queue.Length * 2)];
        }
        // _piece doubles as the "reached from outside" mark here; it is cleared again before splitting.
        Array.Fill(_piece, 0, 0, n);
        int head = 0, tail = 0;
        for (int i = 0; i < n; i++)
        {
            int x = i % pw, y = i / pw;
            if ((x == 0 || y == 0 || x == pw - 1 || y == ph - 1) && _features[i] != 0)
            {
                _piece[i] = 1;
                _queue[tail++] = i;
            }
        }
        while (head < tail)
        {
            int p = _queue[head++];
            int x = p % pw;
            Reach(p - pw, p >= pw);
            Reach(p + pw, p + pw < n);
            Reach(p - 1, x > 0);
            Reach(p + 1, x < pw - 1);
        }
        int holes = 0;
        for (int i = 0; i < n; i++)
        {
            if (_features[i] != 0 && _piece[i] == 0)
            {
                holes++;
            }
        }
        if (holes == 0 || holes > maxHolePixels)
        {
            return 0;
        }
        int added = 0;
        for (int i = 0; i < n; i++)
        {
            if (_features[i] != 0 && _piece[i] == 0)
            {
                int src = ((i / pw) - 1 + box.MinY) * width + (i % pw) - 1 + box.MinX;
                if (labels[src] == 0)
                {
                    labels[src] = label;
                    _features[i] = 0;
                    added++;
                }
            }
        }
        return added;

        void Reach(int q, bool inside)
        {
            if (inside && _features[q] != 0 && _piece[q] == 0)
            {
                _piece[q] = 1;
                _queue[tail++] = q;
            }
        }
    }

    private int Flood(int pw, int n)
    {
        int count = 0;
        for (int i = 0; i < n; i++)
        {
            if (_features[i] == 0)
            {
                _order[count] = i;
                _keys[count] = -_distance2[i];
                _parent[i] = -1;
                count++;
            }
        }
        Array.Sort(_keys, _order, 0, count);
        for (int k = 0; k < count; k++)
        {
            int p = _order[k];
            int level2 = _distance2[p];
            _parent[p] = p;
            _peak[p] = level2;
            _significant[p] = false;
            double level = Math.Sqrt(level2);
            // Join the basin of the highest processed neighbour first (steepest ascent), so that a run of
            // equal-distance pixels along an outline cannot carry one basin around its neighbour.
            int steepest = -1;
            foreach (var (dx, dy) in Neighbours8)
            {
                int q = p + dy * pw + dx;
                if (_features[q] == 0 && _parent[q] >= 0 && (steepest < 0 || _distance2[q] > _distance2[steepest]))
                {
                    steepest = q;
                }
            }
            if (steepest >= 0)
            {
                _parent[p] = Find(steepest);
            }
            foreach (var (dx, dy) in Neighbours8)
            {
                int q = p + dy * pw + dx;
                if (_features[q] != 0 || _parent[q] < 0)
                {
                    continue;
                }
                int rp = Find(p);
                int rq = Find(q);
                if (rp == rq)
                {
                    continue;
                }
                (int low, int high) = _peak[rp] < _peak[rq] || (_peak[rp] == _peak[rq] && rp > rq) ? (rp, rq) : (rq, rp);
                if (!_significant[low] && Math.Sqrt(_peak[low]) - level < hMaximaPixels)
                {
                    _parent[low] = high;
                }
                else
                {
                    _significant[low] = true;
                }
            }
        }
        int pieces = 0;
        for (int i = 0; i < n; i++)
        {
            if (_features[i] == 0)
            {
                int r = Find(i);
                if (r == i)
                {
                    _rootPiece[i] = pieces++;
                }
            }
        }
        for (int i = 0; i < n; i++)
        {
            if (_features[i] == 0)
            {
                _piece[i] = _rootPiece[Find(i)];
            }
        }
        return pieces;
    }

    private int Find(int x)
    {
        while (_parent[x] != x)
        {
            _parent[x] = _parent[_parent[x]];
            x = _parent[x];
        }
        return x;
    }

    private void Measure(ushort[] intensity, int width, int label, in ComponentBox box, int pw, int ph, int pieces, List<RawWire> output)
    {
        // Per piece: area, Σx, Σy, Σintensity, crack edges, minX, minY, maxX, maxY.
        const int Stride = 9;
        if (_sums.Length < pieces * Stride)
        {
            _sums = new long[pieces * Stride * 2];
        }
        if (_rowMin.Length < pieces * ph)
        {
            _rowMin = new int[pieces * ph * 2];
            _rowMax = new int[pieces * ph * 2];
        }
        Array.Clear(_sums, 0, pieces * Stride);
        Array.Fill(_rowMin, int.MaxValue, 0, pieces * ph);
        Array.Fill(_rowMax, int.MinValue, 0, pieces * ph);
        for (int k = 0; k < pieces; k++)
        {
            _sums[k * Stride + 5] = int.MaxValue;
            _sums[k * Stride + 6] = int.MaxValue;
            _sums[k * Stride + 7] = int.MinValue;
            _sums[k * Stride + 8] = int.MinValue;
        }
        for (int py = 1; py < ph - 1; py++)
        {
            int y = py - 1 + box.MinY;
            for (int px = 1; px < pw - 1; px++)
            {
                int i = py * pw + px;
                if (_features[i] != 0)
                {
                    continue;
                }
                int k = _piece[i];
                int x = px - 1 + box.MinX;
                int s = k * Stride;
                _sums[s]++;
                _sums[s + 1] += x;
                _sums[s + 2] += y;
                _sums[s + 3] += intensity[y * width + x];
                _sums[s + 4] += Edge(i - 1, k) + Edge(i + 1, k) + Edge(i - pw, k) + Edge(i + pw, k);
                _sums[s + 5] = Math.Min(_sums[s + 5], x);
                _sums[s + 6] = Math.Min(_sums[s + 6], y);
                _sums[s + 7] = Math.Max(_sums[s + 7], x);
                _sums[s + 8] = Math.Max(_sums[s + 8], y);
                int r = k * ph + py;
                _rowMin[r] = Math.Min(_rowMin[r], x);
                _rowMax[r] = Math.Max(_rowMax[r], x);
            }
        }
        for (int k = 0; k < pieces; k++)
        {
            int s = k * Stride;
            long area = _sums[s];
            if (area == 0)
            {
                continue;
            }
            int np = 0;
            for (int py = 1; py < ph - 1; py++)
            {
                int r = k * ph + py;
                if (_rowMin[r] == int.MaxValue)
                {
                    continue;
                }
                int y = py - 1 + box.MinY;
                // Pixel (x, y) covers [x, x+1) × [y, y+1): the hull is taken over the corners of each row's end pixels.
                _points[np++] = (_rowMin[r], y);
                _points[np++] = (_rowMin[r], y + 1);
                _points[np++] = (_rowMax[r] + 1, y);
                _points[np++] = (_rowMax[r] + 1, y + 1);
            }
            int nh = ConvexHull.Build(_points.AsSpan(0, np), _hull);
            ReadOnlySpan<(int X, int Y)> hull = _hull.AsSpan(0, nh);
            (double minF, double maxF) = ConvexHull.Feret(hull);
            output.Add(new RawWire
            {
                Label = label,
                Area = (int)area,
                CentroidX = (double)_sums[s + 1] / area + 0.5,
                CentroidY = (double)_sums[s + 2] / area + 0.5,
                MeanIntensity = (double)_sums[s + 3] / area,
                Perimeter = _sums[s + 4] * Math.PI / 4,
                MinFeret = minF,
                MaxFeret = maxF,
                HullArea = ConvexHull.Area(hull),
                MinX = (int)_sums[s + 5],
                MinY = (int)_sums[s + 6],
                MaxX = (int)_sums[s + 7],
                MaxY = (int)_sums[s + 8],
                FromSplit = pieces > 1,
            });
        }
    }

    private int Edge(int neighbour, int piece) => _features[neighbour] != 0 || _piece[neighbour] != piece ? 1 : 0;

    private void EnsureCapacity(int n, int pw, int ph)
    {
        if (_features.Length < n)
        {
            int c = Math.Max(n, _features.Length * 2);
            _features = new int[c];
            _distance2 = new int[c];
            _nearestRow = new int[c];
            _parent = new int[c];
            _peak = new int[c];
            _significant = new bool[c];
            _order = new int[c];
            _keys = new int[c];
            _piece = new int[c];
            _rootPiece = new int[c];
        }
        int line = Math.Max(pw, ph);
        if (_column.Length < line)
        {
            _column = new int[line * 2];
            _rowScratch = new DistanceTransform.RowScratch(line * 2);
        }
        if (_points.Length < 4 * ph)
        {
            _points = new (int, int)[8 * ph];
            _hull = new (int, int)[8 * ph + 1];
        }
    }
}
