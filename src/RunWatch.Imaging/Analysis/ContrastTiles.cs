using RunWatch.Imaging.Measurement;

namespace RunWatch.Imaging.Analysis;

/// <summary>Median top contrast of the wire candidates per tile of the field (global median where a tile has fewer than 5); tiles hold about 8, so slow charging drift cancels.</summary>
internal sealed class ContrastTiles
{
    private const int PerTile = 8;
    private const int MinPerTile = 5;
    private readonly double[] _median;
    private readonly int _columns;
    private readonly int _rows;
    private readonly double _tile;
    private readonly double _global;

    private ContrastTiles(double[] median, int columns, int rows, double tile, double global)
    {
        _median = median;
        _columns = columns;
        _rows = rows;
        _tile = tile;
        _global = global;
    }

    public static ContrastTiles Flat(double global) => new([], 0, 0, 1, global);

    public static ContrastTiles Build(List<RawWire> raw, EdgeProfile[] edges, List<int> candidates, int width, int height, double global)
    {
        // Tiles sized to hold about PerTile candidates each.
        double tile = Math.Max(48, Math.Sqrt((double)width * height * PerTile / Math.Max(1, candidates.Count)));
        int columns = Math.Max(1, (int)Math.Ceiling(width / tile)), rows = Math.Max(1, (int)Math.Ceiling(height / tile));
        var lists = new List<double>[columns * rows];
        foreach (int i in candidates)
        {
            int t = Index(raw[i].CentroidX, raw[i].CentroidY, tile, columns, rows);
            (lists[t] ??= []).Add(edges[i].Top - edges[i].Substrate);
        }
        var median = new double[lists.Length];
        for (int t = 0; t < lists.Length; t++)
        {
            List<double>? l = lists[t];
            if (l is null || l.Count < MinPerTile)
            {
                median[t] = global;
                continue;
            }
            l.Sort();
            median[t] = DistributionSummary.Percentile(l.ToArray(), 50);
        }
        return new ContrastTiles(median, columns, rows, tile, global);
    }

    public double At(double x, double y) => _median.Length == 0 ? _global : _median[Index(x, y, _tile, _columns, _rows)];

    private static int Index(double x, double y, double tile, int columns, int rows) =>
        (Math.Clamp((int)(y / tile), 0, rows - 1) * columns) + Math.Clamp((int)(x / tile), 0, columns - 1);
}
