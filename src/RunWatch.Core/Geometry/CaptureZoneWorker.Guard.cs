namespace RunWatch.Core.Geometry;

/// <summary>Guard-zone flags of <see cref="CaptureZoneWorker"/> (see <see cref="GuardRule"/>).</summary>
internal sealed partial class CaptureZoneWorker
{
    /// <summary>
    /// Guard-zone rule (DESIGN.md): finite L — the disc of radius L leaves the field or reaches the excluded band;
    /// infinite L — the cell reaches the field edge (or the band's edge where the band was cut off) or overlaps the band.
    /// </summary>
    private bool IsGuarded(double px, double py)
    {
        CaptureField field = _grid.Field;
        if (_finite)
        {
            if (px - _length < field.MinX || px + _length > field.MaxX || py - _length < field.MinY || py + _length > field.MaxY)
            {
                return true;
            }
            return field.Band is { } band && band.DistanceSquaredTo(px, py) < _length * _length;
        }
        double tol = _edgeTolerance;
        for (int i = 0; i < _count; i++)
        {
            double x = _xs[i] + px, y = _ys[i] + py;
            if (x <= _clipMinX + tol || x >= _clipMaxX - tol || y <= _clipMinY + tol || y >= _clipMaxY - tol)
            {
                return true;
            }
        }
        return field.Band is { } b && OverlapsRectangle(px, py, b);
    }

    /// <summary>Airtight rule: the nearest place an unseen wire could be (outside the field, or in the band) is closer than 2R.</summary>
    private bool UnseenNeighbourCouldCut(double px, double py, double reach2)
    {
        CaptureField field = _grid.Field;
        double edge = Math.Min(Math.Min(px - field.MinX, field.MaxX - px), Math.Min(py - field.MinY, field.MaxY - py));
        double free2 = edge * edge;
        if (field.Band is { } band)
        {
            free2 = Math.Min(free2, band.DistanceSquaredTo(px, py));
        }
        return free2 < 4.0 * reach2;
    }

    /// <summary>Separating-axis test of the convex cell against an axis-aligned rectangle.</summary>
    private bool OverlapsRectangle(double px, double py, ExcludedBand b)
    {
        double minX = double.MaxValue, minY = double.MaxValue, maxX = double.MinValue, maxY = double.MinValue;
        for (int i = 0; i < _count; i++)
        {
            double x = _xs[i] + px, y = _ys[i] + py;
            minX = Math.Min(minX, x);
            maxX = Math.Max(maxX, x);
            minY = Math.Min(minY, y);
            maxY = Math.Max(maxY, y);
        }
        if (maxX < b.MinX || minX > b.MaxX || maxY < b.MinY || minY > b.MaxY)
        {
            return false;
        }
        for (int i = 0; i < _count; i++)
        {
            int j = i + 1 == _count ? 0 : i + 1;
            double ex = _xs[j] - _xs[i], ey = _ys[j] - _ys[i];
            // Outward normal of a counter-clockwise edge is (ey, -ex); the rectangle is separated if all its
            // corners lie beyond this edge.
            double nx = ey, ny = -ex;
            double c = (nx * (_xs[i] + px)) + (ny * (_ys[i] + py));
            if ((nx * b.MinX) + (ny * b.MinY) > c && (nx * b.MaxX) + (ny * b.MinY) > c
                && (nx * b.MinX) + (ny * b.MaxY) > c && (nx * b.MaxX) + (ny * b.MaxY) > c)
            {
                return false;
            }
        }
        return true;
    }
}
