using System.Globalization;
using Microsoft.Extensions.Options;

namespace RunWatch.Web;

/// <summary>Shows times in the lab's local time with the UTC offset, and gives "now" from the host's TimeProvider.</summary>
public sealed class DashboardClock(TimeProvider time, IOptions<DashboardOptions> options)
{
    private readonly TimeZoneInfo _zone = string.IsNullOrWhiteSpace(options.Value.TimeZone)
        ? TimeZoneInfo.Local
        : TimeZoneInfo.FindSystemTimeZoneById(options.Value.TimeZone);

    public DateTimeOffset Now => time.GetUtcNow();

    public TimeZoneInfo Zone => _zone;

    public DateTimeOffset ToLocal(DateTimeOffset t) => TimeZoneInfo.ConvertTime(t, _zone);

    /// <summary>For example "2026-03-04 11:00:05 UTC+01:00".</summary>
    public string Format(DateTimeOffset t)
    {
        var local = ToLocal(t);
        return local.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture) + " " + OffsetLabel(local.Offset);
    }

    /// <summary>Like Format without the date, for the same day.</summary>
    public string FormatTime(DateTimeOffset t)
    {
        var local = ToLocal(t);
        return local.ToString("HH:mm:ss", CultureInfo.InvariantCulture) + " " + OffsetLabel(local.Offset);
    }

    public string Format(DateTimeOffset? t) => t is null ? "—" : Format(t.Value);

    /// <summary>The offset now, for axis titles: "UTC+01:00".</summary>
    public string CurrentOffsetLabel => OffsetLabel(ToLocal(Now).Offset);

    /// <summary>A chart x value: local wall time as plotly reads dates ("yyyy-MM-dd HH:mm:ss.fff").</summary>
    public string ChartTime(double unixSeconds) =>
        ToLocal(DateTimeOffset.FromUnixTimeMilliseconds((long)Math.Round(unixSeconds * 1000))).ToString("yyyy-MM-dd HH:mm:ss.fff", CultureInfo.InvariantCulture);

    public string ChartTime(DateTimeOffset t) => ChartTime(t.ToUnixTimeMilliseconds() / 1000.0);

    /// <summary>Parses a chart x value back (local wall time) to an instant; null if it is not a date.</summary>
    public DateTimeOffset? ParseChartTime(object? value)
    {
        string? text = value?.ToString();
        if (text is null || !DateTime.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.None, out var wall))
        {
            return null;
        }
        var unspecified = DateTime.SpecifyKind(wall, DateTimeKind.Unspecified);
        return new DateTimeOffset(unspecified, _zone.GetUtcOffset(unspecified));
    }

    public static string OffsetLabel(TimeSpan offset) =>
        "UTC" + (offset < TimeSpan.Zero ? "−" : "+") + offset.Duration().ToString(@"hh\:mm", CultureInfo.InvariantCulture);
}
