using RunWatch.Core.Geometry;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Growable bucket grid (linked lists in arrays) for "is any site within d" queries while sites are added.
/// Cells are at least d wide, so a query looks at the 3 × 3 cells around it; periodic fields wrap.
/// </summary>
internal sealed class HardCoreIndex
{
    private readonly CaptureField _field;
    private readonly int _cellsX, _cellsY;
    private readonly double _cellWidth, _cellHeight;
    private readonly int[] _head;
    private int[] _next;

    public HardCoreIndex(CaptureField field, double minDistance, int expectedCount, int maxCells)
    {
        _field = field;
        double side = Math.Max(minDistance, Math.Sqrt(field.Area / Math.Max(1, expectedCount)));
        _cellsX = (int)Math.Max(1, Math.Floor(field.Width / side));
        _cellsY = (int)Math.Max(1, Math.Floor(field.Height / side));
        while ((long)_cellsX * _cellsY > maxCells)
        {
            _cellsX = Math.Max(1, _cellsX / 2);
            _cellsY = Math.Max(1, _cellsY / 2);
        }
        _cellWidth = field.Width / _cellsX;
        _cellHeight = field.Height / _cellsY;
        _head = new int[_cellsX * _cellsY];
        Array.Fill(_head, -1);
        _next = new int[Math.Max(16, expectedCount)];
    }

    public void Add(Point2D p, int id)
    {
        if (id >= _next.Length)
        {
            Array.Resize(ref _next, Math.Max(id + 1, 2 * _next.Length));
        }
        int cell = Cell(p);
        _next[id] = _head[cell];
        _head[cell] = id;
    }

    public bool HasNeighbourCloserThan(Point2D p, double distance, List<Point2D> sites, int self)
    {
        double d2 = distance * distance;
        int cx = CellX(p.X), cy = CellY(p.Y);
        for (int dy = -1; dy <= 1; dy++)
        {
            for (int dx = -1; dx <= 1; dx++)
            {
                if (!TryCell(cx + dx, cy + dy, out int cell))
                {
                    continue;
                }
                for (int id = _head[cell]; id >= 0; id = _next[id])
                {
                    if (id != self && DistanceSquared(p, sites[id]) < d2)
                    {
                        return true;
                    }
                }
            }
        }
        return false;
    }

    public bool HasSmallerMarkWithin(Point2D p, int self, double distance, List<Point2D> sites, double[] marks)
    {
        double d2 = distance * distance;
        int cx = CellX(p.X), cy = CellY(p.Y);
        for (int dy = -1; dy <= 1; dy++)
        {
            for (int dx = -1; dx <= 1; dx++)
            {
                if (!TryCell(cx + dx, cy + dy, out int cell))
                {
                    continue;
                }
                for (int id = _head[cell]; id >= 0; id = _next[id])
                {
                    if (id != self && marks[id] < marks[self] && DistanceSquared(p, sites[id]) < d2)
                    {
                        return true;
                    }
                }
            }
        }
        return false;
    }

    private bool TryCell(int gx, int gy, out int cell)
    {
        if (_field.Periodic)
        {
            // With fewer than three cells on an axis, wrapping would visit a cell twice: harmless for "any within".
            gx = ((gx % _cellsX) + _cellsX) % _cellsX;
            gy = ((gy % _cellsY) + _cellsY) % _cellsY;
        }
        else if (gx < 0 || gx >= _cellsX || gy < 0 || gy >= _cellsY)
        {
            cell = -1;
            return false;
        }
        cell = (gy * _cellsX) + gx;
        return true;
    }

    private double DistanceSquared(Point2D a, Point2D b)
    {
        double dx = Math.Abs(a.X - b.X), dy = Math.Abs(a.Y - b.Y);
        if (_field.Periodic)
        {
            dx = Math.Min(dx, _field.Width - dx);
            dy = Math.Min(dy, _field.Height - dy);
        }
        return (dx * dx) + (dy * dy);
    }

    private int Cell(Point2D p) => (CellY(p.Y) * _cellsX) + CellX(p.X);

    private int CellX(double x) => Math.Clamp((int)((x - _field.MinX) / _cellWidth), 0, _cellsX - 1);

    private int CellY(double y) => Math.Clamp((int)((y - _field.MinY) / _cellHeight), 0, _cellsY - 1);
}
