namespace RunWatch.Imaging.Segmentation;

/// <summary>
/// Cuts a piece at a pair of notches: where two hexagonal tops touch face to face the distance transform has no
/// saddle when one is smaller (the small one is a bump on the big one), but the outline keeps two notches, one at
/// each end of the shared face. A notch is a boundary pixel deep inside the convex hull (depth ≥ the limit); the two
/// deepest notches under different hull edges are joined by a straight cut when the cut runs through the piece and
/// leaves both sides a fair share. Pieces are cut again until no pair remains (chains of three). Convexity-defect
/// splitting is COMMON PRACTICE for touching blobs (no single source). One instance per thread.
/// </summary>
internal sealed class NotchSplitter
{
    private const int MaxCutsPerComponent = 6;
    private const double MinShare = 0.15;
    private const int MinPiecePixels = 24;

    private (int X, int Y)[] _points = [];
    private (int X, int Y)[] _hull = [];
    private int[] _rowMin = [];
    private int[] _rowMax = [];

    /// <summary>Splits pieces of the patch (<paramref name="features"/> 0 = component pixel, <paramref name="piece"/> = piece index); returns the new piece count.</summary>
    public int Split(int[] features, int[] piece, int pw, int ph, int pieces, double minDepth)
    {
        int cuts = 0;
        for (int k = 0; k < pieces && cuts < MaxCutsPerComponent; k++)
        {
            // A successful cut makes a new piece (index `pieces`) and leaves k smaller: look at k again.
            while (cuts < MaxCutsPerComponent && TryCut(features, piece, pw, ph, k, pieces, minDepth))
            {
                pieces++;
                cuts++;
            }
        }
        return pieces;
    }

    private bool TryCut(int[] features, int[] piece, int pw, int ph, int k, int next, double minDepth)
    {
        if (_rowMin.Length < ph)
        {
            _rowMin = new int[ph * 2];
            _rowMax = new int[ph * 2];
            _points = new (int, int)[ph * 8];
            _hull = new (int, int)[(ph * 8) + 1];
        }
        int area = 0;
        for (int y = 0; y < ph; y++)
        {
            _rowMin[y] = int.MaxValue;
            _rowMax[y] = int.MinValue;
            for (int x = 0; x < pw; x++)
            {
                int i = (y * pw) + x;
                if (features[i] == 0 && piece[i] == k)
                {
                    area++;
                    _rowMin[y] = Math.Min(_rowMin[y], x);
                    _rowMax[y] = Math.Max(_rowMax[y], x);
                }
            }
        }
        if (area < 2 * MinPiecePixels)
        {
            return false;
        }
        int np = 0;
        for (int y = 0; y < ph; y++)
        {
            if (_rowMin[y] != int.MaxValue)
            {
                _points[np++] = (_rowMin[y], y);
                _points[np++] = (_rowMin[y], y + 1);
                _points[np++] = (_rowMax[y] + 1, y);
                _points[np++] = (_rowMax[y] + 1, y + 1);
            }
        }
        int nh = Measurement.ConvexHull.Build(_points.AsSpan(0, np), _hull);
        if (nh < 3)
        {
            return false;
        }

        // Deepest boundary pixel per hull edge.
        Span<double> depth = nh <= 256 ? stackalloc double[nh] : new double[nh];
        Span<int> at = nh <= 256 ? stackalloc int[nh] : new int[nh];
        depth.Clear();
        at.Fill(-1);
        for (int y = 0; y < ph; y++)
        {
            for (int x = 0; x < pw; x++)
            {
                int i = (y * pw) + x;
                if (features[i] != 0 || piece[i] != k || !OnBoundary(features, piece, pw, ph, x, y, k))
                {
                    continue;
                }
                double cx = x + 0.5, cy = y + 0.5;
                double best = double.PositiveInfinity;
                int edge = -1;
                for (int e = 0; e < nh; e++)
                {
                    var a = _hull[e];
                    var b = _hull[(e + 1) % nh];
                    double ex = b.X - a.X, ey = b.Y - a.Y;
                    double d = Math.Abs((ex * (cy - a.Y)) - (ey * (cx - a.X))) / Math.Sqrt((ex * ex) + (ey * ey));
                    if (d < best)
                    {
                        best = d;
                        edge = e;
                    }
                }
                best -= 0.5;
                if (edge >= 0 && best > depth[edge])
                {
                    depth[edge] = best;
                    at[edge] = i;
                }
            }
        }
        int first = -1, second = -1;
        for (int e = 0; e < nh; e++)
        {
            if (at[e] < 0 || depth[e] < minDepth)
            {
                continue;
            }
            if (first < 0 || depth[e] > depth[first])
            {
                second = first;
                first = e;
            }
            else if (second < 0 || depth[e] > depth[second])
            {
                second = e;
            }
        }
        if (second < 0)
        {
            return false;
        }
        int p1 = at[first], p2 = at[second];
        double x1 = (p1 % pw) + 0.5, y1 = (p1 / pw) + 0.5, x2 = (p2 % pw) + 0.5, y2 = (p2 / pw) + 0.5;
        double length = Math.Sqrt(((x2 - x1) * (x2 - x1)) + ((y2 - y1) * (y2 - y1)));
        if (length < 1)
        {
            return false;
        }
        // The cut must run through the piece.
        for (double t = 0; t <= 1; t += 0.5 / length)
        {
            int sx = (int)(x1 + (t * (x2 - x1))), sy = (int)(y1 + (t * (y2 - y1)));
            int i = (sy * pw) + sx;
            if (features[i] != 0 || piece[i] != k)
            {
                return false;
            }
        }
        int side = 0;
        for (int i = 0; i < pw * ph; i++)
        {
            if (features[i] == 0 && piece[i] == k && Side(i, pw, x1, y1, x2, y2) > 0)
            {
                side++;
            }
        }
        int min = Math.Max(MinPiecePixels, (int)(MinShare * area));
        if (side < min || area - side < min)
        {
            return false;
        }
        for (int i = 0; i < pw * ph; i++)
        {
            if (features[i] == 0 && piece[i] == k && Side(i, pw, x1, y1, x2, y2) > 0)
            {
                piece[i] = next;
            }
        }
        return true;
    }

    private static double Side(int i, int pw, double x1, double y1, double x2, double y2) =>
        ((x2 - x1) * ((i / pw) + 0.5 - y1)) - ((y2 - y1) * ((i % pw) + 0.5 - x1));

    private static bool OnBoundary(int[] features, int[] piece, int pw, int ph, int x, int y, int k)
    {
        return Outside(x - 1, y) || Outside(x + 1, y) || Outside(x, y - 1) || Outside(x, y + 1);

        bool Outside(int qx, int qy)
        {
            if (qx < 0 || qy < 0 || qx >= pw || qy >= ph)
            {
                return true;
            }
            int q = (qy * pw) + qx;
            return features[q] != 0 || piece[q] != k;
        }
    }
}
