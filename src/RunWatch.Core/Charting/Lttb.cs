namespace RunWatch.Core.Charting;

/// <summary>
/// Largest-Triangle-Three-Buckets downsampling: keeps the first and last points and, from each of
/// <c>threshold − 2</c> equal buckets between them, the point forming the largest triangle with the point kept
/// from the previous bucket and the mean of the next bucket.
/// Source: S. Steinarsson (2013), "Downsampling Time Series for Visual Representation", MSc thesis,
/// University of Iceland, section 4.2 (Algorithm 4.2, LTTB).
/// </summary>
/// <remarks>Pure and allocation-free; thread-safe. X must be ascending and both series finite.</remarks>
public static class Lttb
{
    /// <summary>
    /// Selects the indices of the points to keep.
    /// </summary>
    /// <param name="x">Ascending abscissae (for example seconds since an epoch).</param>
    /// <param name="y">Ordinates, same length as <paramref name="x"/>.</param>
    /// <param name="destination">Receives the kept indices in ascending order; its length is the threshold.</param>
    /// <returns>The number of indices written: <c>min(x.Length, destination.Length)</c>.</returns>
    /// <exception cref="ArgumentException">Lengths differ, or the threshold is below 3 for a longer series.</exception>
    public static int SelectIndices(ReadOnlySpan<double> x, ReadOnlySpan<double> y, Span<int> destination)
    {
        if (x.Length != y.Length)
        {
            throw new ArgumentException("x and y must have the same length.", nameof(y));
        }
        int n = x.Length;
        int threshold = destination.Length;
        if (threshold >= n)
        {
            for (int i = 0; i < n; i++)
            {
                destination[i] = i;
            }
            return n;
        }
        if (threshold < 3)
        {
            throw new ArgumentException("A threshold below 3 cannot keep the first, last and one inner point.", nameof(destination));
        }

        // Bucket width over the inner points (first and last are kept as they are).
        double every = (double)(n - 2) / (threshold - 2);
        int a = 0;
        destination[0] = 0;
        for (int bucket = 0; bucket < threshold - 2; bucket++)
        {
            // Mean of the next bucket (the last point when the next bucket is the final one).
            int nextStart = (int)Math.Floor((bucket + 1) * every) + 1;
            int nextEnd = Math.Min((int)Math.Floor((bucket + 2) * every) + 1, n);
            double meanX = 0;
            double meanY = 0;
            for (int j = nextStart; j < nextEnd; j++)
            {
                meanX += x[j];
                meanY += y[j];
            }
            int nextCount = nextEnd - nextStart;
            meanX /= nextCount;
            meanY /= nextCount;

            int start = (int)Math.Floor(bucket * every) + 1;
            int end = (int)Math.Floor((bucket + 1) * every) + 1;
            double ax = x[a];
            double ay = y[a];
            double maxArea = -1;
            int chosen = start;
            for (int j = start; j < end; j++)
            {
                // Twice the triangle's area; the factor 1/2 does not change which point wins.
                double area = Math.Abs(((ax - meanX) * (y[j] - ay)) - ((ax - x[j]) * (meanY - ay)));
                if (area > maxArea)
                {
                    maxArea = area;
                    chosen = j;
                }
            }
            destination[bucket + 1] = chosen;
            a = chosen;
        }
        destination[threshold - 1] = n - 1;
        return threshold;
    }

    /// <summary>Downsamples into caller buffers; returns the number of points written to both outputs.</summary>
    /// <param name="x">Ascending abscissae.</param>
    /// <param name="y">Ordinates.</param>
    /// <param name="outX">Receives kept abscissae; its length is the threshold.</param>
    /// <param name="outY">Receives kept ordinates; at least as long as <paramref name="outX"/>.</param>
    /// <param name="indexScratch">Scratch of at least <c>outX.Length</c> ints.</param>
    public static int Downsample(ReadOnlySpan<double> x, ReadOnlySpan<double> y, Span<double> outX, Span<double> outY, Span<int> indexScratch)
    {
        if (outY.Length < outX.Length || indexScratch.Length < outX.Length)
        {
            throw new ArgumentException("Output and scratch buffers must be at least as long as outX.", nameof(outY));
        }
        int count = SelectIndices(x, y, indexScratch[..outX.Length]);
        for (int i = 0; i < count; i++)
        {
            int k = indexScratch[i];
            outX[i] = x[k];
            outY[i] = y[k];
        }
        return count;
    }
}
