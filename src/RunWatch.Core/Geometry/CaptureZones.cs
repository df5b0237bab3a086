namespace RunWatch.Core.Geometry;

/// <summary>
/// Centroid-based capture zones: each point's Voronoi cell ∩ disc of radius L ∩ field, with exact areas
/// (analytic circle–polygon intersection) and the guard-zone flag. See docs/geometry.md.
/// </summary>
public static class CaptureZones
{
    private const int PointsPerChunk = 512;
    private const int SequentialBelow = 4096;

    /// <summary>
    /// Computes every point's zone. Points are in the field's unit and must lie inside it and be distinct.
    /// Thread-safe; runs in parallel over points when the input is large.
    /// </summary>
    /// <exception cref="ArgumentException">A point is outside the field or non-finite, two points coincide, or an option is out of range.</exception>
    /// <exception cref="OperationCanceledException"><paramref name="cancellationToken"/> was cancelled (checked once per chunk of points).</exception>
    public static CaptureZoneResult Compute(ReadOnlySpan<Point2D> points, CaptureField field, CaptureZoneOptions? options = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(field);
        options ??= new CaptureZoneOptions();
        options.Validate();

        var grid = new PointGrid(points, field);
        int n = points.Length;
        var areas = new double[n];
        var guarded = new bool[n];
        double length = options.DiffusionLength;
        double arcStep = options.OutlineArcStepDegrees * Math.PI / 180.0;
        bool outlines = options.IncludeOutlines;

        // Work in grid (slot) order so neighbouring queries touch neighbouring memory.
        int chunks = (n + PointsPerChunk - 1) / PointsPerChunk;
        var chunkOutlines = outlines ? new List<Point2D>[chunks] : null;
        var outlineCounts = outlines ? new int[n] : null;
        int threads = options.MaxDegreeOfParallelism == 0 ? Environment.ProcessorCount : options.MaxDegreeOfParallelism;

        void RunChunk(int chunk, CaptureZoneWorker worker)
        {
            cancellationToken.ThrowIfCancellationRequested();
            int start = chunk * PointsPerChunk, end = Math.Min(n, start + PointsPerChunk);
            List<Point2D>? buffer = outlines ? new List<Point2D>((end - start) * 8) : null;
            for (int slot = start; slot < end; slot++)
            {
                int before = buffer?.Count ?? 0;
                (double area, bool guard) = worker.Compute(slot, buffer);
                int index = grid.Index[slot];
                areas[index] = area;
                guarded[index] = guard;
                if (buffer is not null)
                {
                    outlineCounts![index] = buffer.Count - before;
                }
            }
            if (chunkOutlines is not null)
            {
                chunkOutlines[chunk] = buffer!;
            }
        }

        try
        {
            if (n < SequentialBelow || threads == 1)
            {
                var worker = new CaptureZoneWorker(grid, length, arcStep, options.GuardRule);
                for (int chunk = 0; chunk < chunks; chunk++)
                {
                    RunChunk(chunk, worker);
                }
            }
            else
            {
                Parallel.For(
                    0,
                    chunks,
                    new ParallelOptions { MaxDegreeOfParallelism = threads, CancellationToken = cancellationToken },
                    () => new CaptureZoneWorker(grid, length, arcStep, options.GuardRule),
                    (chunk, _, worker) =>
                    {
                        RunChunk(chunk, worker);
                        return worker;
                    },
                    _ => { });
            }
        }
        catch (AggregateException ex) when (ex.InnerException is ArgumentException inner)
        {
            throw new ArgumentException(inner.Message, nameof(points), inner);
        }

        if (chunkOutlines is null || outlineCounts is null)
        {
            return new CaptureZoneResult(length, areas, guarded, null, null);
        }
        return new CaptureZoneResult(length, areas, guarded, OutlineStarts(outlineCounts), GatherOutlines(grid, chunkOutlines, outlineCounts));
    }

    private static int[] OutlineStarts(int[] counts)
    {
        var start = new int[counts.Length + 1];
        for (int i = 0; i < counts.Length; i++)
        {
            start[i + 1] = start[i] + counts[i];
        }
        return start;
    }

    /// <summary>Re-orders outlines from slot order (as computed, chunk by chunk) to input order.</summary>
    private static Point2D[] GatherOutlines(PointGrid grid, List<Point2D>[] chunkOutlines, int[] counts)
    {
        int[] start = OutlineStarts(counts);
        var vertices = new Point2D[start[^1]];
        for (int chunk = 0; chunk < chunkOutlines.Length; chunk++)
        {
            List<Point2D> buffer = chunkOutlines[chunk];
            int offset = 0;
            int end = Math.Min(grid.Count, (chunk + 1) * PointsPerChunk);
            for (int slot = chunk * PointsPerChunk; slot < end; slot++)
            {
                int index = grid.Index[slot];
                for (int k = 0; k < counts[index]; k++)
                {
                    vertices[start[index] + k] = buffer[offset + k];
                }
                offset += counts[index];
            }
        }
        return vertices;
    }
}
