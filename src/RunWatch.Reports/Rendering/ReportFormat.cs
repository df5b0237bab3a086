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

    public static string Time(DateTimeOffset value) => value.ToUniversalTime().ToString("yyyy-MM-dd HH:mm:ss 'UTC'", CultureInfo.InvariantCulture);

    public static string Time(DateTimeOffset? value) => value is { } v ? Time(v) : Missing;

    public static string Minutes(double seconds) => Number(seconds / 60, "0.0") + " min";

    public static string Measured(double? value, string unit)
    {
        if (value is not { } v)
        {
            return "not measured";
        }
        string text = Math.Abs(v) >= 1e5 ? Scientific(v) : Number(v, "0.###");
        return unit.Length > 0 ? text + " " + unit : text;
    }
}
