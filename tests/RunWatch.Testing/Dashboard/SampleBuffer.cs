using RunWatch.Web.Data;

namespace RunWatch.Testing.Dashboard;

/// <summary>Growable parallel arrays of one channel's samples, ascending by time. Not thread-safe (the owner locks).</summary>
internal sealed class SampleBuffer
{
    private double[] _times = new double[1024];
    private double[] _values = new double[1024];

    public int Count { get; private set; }

    public void Append(ReadOnlySpan<double> unixSeconds, ReadOnlySpan<double> values)
    {
        if (unixSeconds.Length > 0 && Count > 0 && unixSeconds[0] < _times[Count - 1])
        {
            throw new ArgumentException("Samples must be appended in time order.", nameof(unixSeconds));
        }
        int needed = Count + unixSeconds.Length;
        if (needed > _times.Length)
        {
            int size = Math.Max(needed, _times.Length * 2);
            Array.Resize(ref _times, size);
            Array.Resize(ref _values, size);
        }
        unixSeconds.CopyTo(_times.AsSpan(Count));
        values.CopyTo(_values.AsSpan(Count));
        Count = needed;
    }

    public (double Time, double Value)? Latest => Count == 0 ? null : (_times[Count - 1], _values[Count - 1]);

    public SampleSeries Range(double from, double to)
    {
        var times = _times.AsSpan(0, Count);
        int start = LowerBound(times, from);
        int end = LowerBound(times, Math.BitIncrement(to));
        return new SampleSeries(times[start..end].ToArray(), _values.AsSpan(start, end - start).ToArray());
    }

    private static int LowerBound(ReadOnlySpan<double> sorted, double value)
    {
        int lo = 0;
        int hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < value)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }
        return lo;
    }
}
