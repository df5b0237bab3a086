using RunWatch.Imaging.Segmentation;

namespace RunWatch.Imaging.Analysis;

/// <summary>
/// Edge-based capture zones on the raster: every substrate pixel goes to the wire whose nearest pixel is
/// closest (the feature transform of <see cref="DistanceTransform"/>), if that distance is at most L. A zone's
/// area counts substrate pixels only, not the wire's own footprint. Rows from <c>validHeight</c> down (the
/// excluded band) are neither substrate nor wire.
/// </summary>
internal static class RasterCaptureZones
{
    /// <summary>Zone area in pixels per label (index = label); optionally writes the zone label of every pixel into <paramref name="zoneMap"/>.</summary>
    public static long[] Compute(int[] labels, int width, int height, int validHeight, int maxLabel, double radiusPixels, int[]? zoneMap, ushort[]? scratch = null,
        CancellationToken cancellationToken = default)
    {
        ushort[] nearestRow = scratch is { } s && s.Length >= labels.Length ? s : new ushort[labels.Length];
        DistanceTransform.ColumnPass16(labels, width, height, nearestRow);
        double limit2 = radiusPixels * radiusPixels;
        var total = new long[maxLabel + 1];
        object gate = new();
        Parallel.For(0, BoxBlur.BandCount(validHeight), new ParallelOptions { CancellationToken = cancellationToken }, () => new long[maxLabel + 1], (band, _, areas) =>
        {
            (int y0, int y1) = BoxBlur.Band(band, validHeight);
            var scratch = new DistanceTransform.RowScratch(width);
            var d2 = new int[width];
            var column = new int[width];
            var rowNear = new int[width];
            for (int y = y0; y < y1; y++)
            {
                if ((y & 15) == 0)
                {
                    cancellationToken.ThrowIfCancellationRequested(); // every 16 rows
                }
                ReadOnlySpan<ushort> packed = nearestRow.AsSpan(y * width, width);
                for (int x = 0; x < width; x++)
                {
                    rowNear[x] = packed[x] == DistanceTransform.NoFeature16 ? DistanceTransform.NoFeature : packed[x];
                }
                ReadOnlySpan<int> rowLabels = labels.AsSpan(y * width, width);
                Span<int> zoneRow = zoneMap is null ? Span<int>.Empty : zoneMap.AsSpan(y * width, width);
                if (!DistanceTransform.RowPass(rowNear, y, d2, column, scratch))
                {
                    zoneRow.Clear();
                    continue;
                }
                for (int x = 0; x < width; x++)
                {
                    int own = rowLabels[x];
                    int zone;
                    if (own != 0)
                    {
                        zone = own;
                    }
                    else if (d2[x] <= limit2)
                    {
                        int c = column[x];
                        zone = labels[rowNear[c] * width + c];
                        areas[zone]++;
                    }
                    else
                    {
                        zone = 0;
                    }
                    if (!zoneRow.IsEmpty)
                    {
                        zoneRow[x] = zone;
                    }
                }
            }
            return areas;
        }, areas =>
        {
            lock (gate)
            {
                for (int i = 0; i < areas.Length; i++)
                {
                    total[i] += areas[i];
                }
            }
        });
        if (zoneMap is not null)
        {
            zoneMap.AsSpan(validHeight * width).Clear();
        }
        return total;
    }
}
