using Microsoft.Extensions.Options;
using RunWatch.Web.Charting;
using RunWatch.Web.Data;
using Xunit;

namespace RunWatch.Web.Tests.Charting;

public sealed class ChartSeriesBuilderTests
{
    private static readonly DashboardClock Clock = new(TimeProvider.System, Options.Create(new DashboardOptions { TimeZone = "Europe/Berlin" }));

    [Fact]
    public void Build_LongSeries_CapsPointsKeepsEndsInLocalTime()
    {
        int n = 360_000;
        var t = new double[n];
        var v = new double[n];
        for (int i = 0; i < n; i++)
        {
            t[i] = 1_772_618_400 + (i * 0.1);
            v[i] = 600 + Math.Sin(i * 0.001);
        }
        var series = ChartSeriesBuilder.Build(new SampleSeries(t, v), 5000, Clock);

        Assert.Equal(5000, series.Points);
        Assert.Equal(n, series.SourcePoints);
        // CONFIRMED (tz database): Berlin is UTC+01:00 in March before the DST change, so 10:00 UTC shows 11:00.
        Assert.Equal("2026-03-04 11:00:00.000", series.X[0]);
        Assert.Equal(v[^1], (double)series.Y[^1]);
    }

    [Fact]
    public void ParseChartTime_RoundTripsLocalWallTime()
    {
        var at = new DateTimeOffset(2026, 7, 1, 8, 30, 0, TimeSpan.Zero);
        Assert.Equal(at, Clock.ParseChartTime(Clock.ChartTime(at)));
        Assert.Equal("2026-07-01 10:30:00 UTC+02:00", Clock.Format(at));
    }
}
