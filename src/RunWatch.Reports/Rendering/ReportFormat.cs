using System.Globalization;

namespace RunWatch.Reports.Rendering;

/// <summary>Culture-invariant number and time formatting for reports; NaN and null print as an em dash.</summary>
internal static class ReportFormat
{
    public const string Missing = "—";

    public static string Number(double value, string format = "0.##") =>
        double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture) : Missing;

    public static string Number(double? value, string format = "0.##") => value is { } v ? Number(v, format) : Missing;

    public static string Scientific(double value) => Number(value, "0.00e+0");

    public static string Percent(double fraction) => double.IsFinite(fraction) ? (fraction * 100).ToString("0.#", CultureInfo.InvariantCulture) + " %" : Missing;

    /// <summary>
    /// Lab-local time with its UTC offset, for example "2026-03-04 11:00:05 UTC+01:00": the one convention of the
    /// reports and the dashboard. <paramref name="zoneId"/> null or empty means the machine's local zone.
    /// </summary>
    public static string Time(DateTimeOffset value, string? zoneId)
    {
        DateTimeOffset local = TimeZoneInfo.ConvertTime(value, Zone(zoneId));
        TimeSpan offset = local.Offset;
        return local.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture) + " UTC" + (offset < TimeSpan.Zero ? "−" : "+")
            + offset.Duration().ToString(@"hh\:mm", CultureInfo.InvariantCulture);
    }

    public static string Time(DateTimeOffset? value, string? zoneId) => value is { } v ? Time(v, zoneId) : Missing;

    /// <summary>The sentence every report carries about its times.</summary>
    public static string ClockNote(string? zoneId) =>
        "Times are the lab's local time (" + Zone(zoneId).Id + ") with their offset from UTC, as on the dashboard.";

    private static TimeZoneInfo Zone(string? zoneId) => string.IsNullOrWhiteSpace(zoneId) ? TimeZoneInfo.Local : TimeZoneInfo.FindSystemTimeZoneById(zoneId);

    public static string Minutes(double seconds) => Number(seconds / 60, "0.0") + " min";

    /// <summary>Model parameters in nm to 0.1 nm like every radius; dimensionless ones to four decimals.</summary>
    public static string ParameterFormat(string unit) => unit == "nm" ? "0.0" : "0.####";

    public static string Measured(double? value, string unit)
    {
        if (value is not { } v)
        {
            return "not measured";
        }
        // Lengths in nm (radii, bias, RMSE) to 0.1 nm, as everywhere else in the report.
        string text = Math.Abs(v) >= 1e5 ? Scientific(v) : Number(v, unit == "nm" ? "0.0" : "0.###");
        return unit.Length > 0 ? text + " " + unit : text;
    }
}
