using System.Buffers;
using RunWatch.Core.Charting;
using RunWatch.Web.Data;

namespace RunWatch.Web.Charting;

/// <summary>Turns stored samples into what a chart ships: at most <c>maxPoints</c>, chosen by LTTB.</summary>
public static class ChartSeriesBuilder
{
    public static ChartSeries Build(SampleSeries samples, int maxPoints, DashboardClock clock)
    {
        ArgumentNullException.ThrowIfNull(samples);
        ArgumentNullException.ThrowIfNull(clock);
        int n = samples.UnixSeconds.Length;
        int keep = Math.Min(n, maxPoints);
        var x = new List<object>(keep);
        var y = new List<object>(keep);
        if (n <= maxPoints)
        {
            for (int i = 0; i < n; i++)
            {
                x.Add(clock.ChartTime(samples.UnixSeconds[i]));
                y.Add(samples.Values[i]);
            }
            return new ChartSeries(x, y, n);
        }
        int[] indices = ArrayPool<int>.Shared.Rent(maxPoints);
        try
        {
            int count = Lttb.SelectIndices(samples.UnixSeconds, samples.Values, indices.AsSpan(0, maxPoints));
            for (int i = 0; i < count; i++)
            {
                int k = indices[i];
                x.Add(clock.ChartTime(samples.UnixSeconds[k]));
                y.Add(samples.Values[k]);
            }
        }
        finally
        {
            ArrayPool<int>.Shared.Return(indices);
        }
        return new ChartSeries(x, y, n);
    }
}
