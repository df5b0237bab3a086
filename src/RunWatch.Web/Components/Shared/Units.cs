using System.Globalization;

namespace RunWatch.Web.Components.Shared;

/// <summary>Number formatting with units, invariant culture (a lab's screens should read the same everywhere).</summary>
public static class Units
{
    public static string Celsius(double? value) => value is { } v && double.IsFinite(v) ? v.ToString("F1", CultureInfo.InvariantCulture) + " °C" : "— °C";

    public static string Kelvin(double value) => value.ToString("+0.0;−0.0;0.0", CultureInfo.InvariantCulture) + " K";

    public static string Nm(double value) => double.IsFinite(value) ? value.ToString("F1", CultureInfo.InvariantCulture) + " nm" : "— nm";

    /// <summary>The value with its unit; "—" for a value that was not measured (NaN or infinite), never "NaN".</summary>
    public static string Number(double value, string format, string unit) =>
        (double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture) : "—") + (unit.Length > 0 ? " " + unit : "");

    public static string Duration(TimeSpan span) =>
        span.TotalHours >= 1 ? string.Create(CultureInfo.InvariantCulture, $"{(int)span.TotalHours} h {span.Minutes:D2} min")
        : string.Create(CultureInfo.InvariantCulture, $"{span.Minutes} min {span.Seconds:D2} s");

    /// <summary>For example 2.5 × 10⁻⁵; "—" for values that are not finite.</summary>
    public static string Scientific(double value)
    {
        if (!double.IsFinite(value))
        {
            return "—";
        }
        if (value == 0)
        {
            return "0";
        }
        int exponent = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        double mantissa = value / Math.Pow(10, exponent);
        const string Superscripts = "⁰¹²³⁴⁵⁶⁷⁸⁹";
        string digits = string.Concat(Math.Abs(exponent).ToString(CultureInfo.InvariantCulture).Select(d => Superscripts[d - '0']));
        return mantissa.ToString("0.##", CultureInfo.InvariantCulture) + " × 10" + (exponent < 0 ? "⁻" : "") + digits;
    }

    public static string Value(double value, string channel)
    {
        // A shutter channel is a state (1 open, 0 closed), not a quantity: say so instead of showing a bare number.
        if (channel.EndsWith("_shutter", StringComparison.Ordinal) && value is 0 or 1)
        {
            return value == 1 ? "open (1)" : "closed (0)";
        }
        string unit = UnitOf(channel);
        return value.ToString(unit == "" ? "G6" : "F1", CultureInfo.InvariantCulture) + (unit == "" ? "" : " " + unit);
    }

    /// <summary>Unit from the channel-name suffix convention (_tc, _sp in °C; _sccm; _pa; flags without unit).</summary>
    public static string UnitOf(string channel) => channel switch
    {
        _ when channel.EndsWith("_tc", StringComparison.Ordinal) || channel.EndsWith("_sp", StringComparison.Ordinal) => "°C",
        _ when channel.EndsWith("_sccm", StringComparison.Ordinal) => "sccm",
        _ when channel.EndsWith("_pa", StringComparison.Ordinal) => "Pa",
        _ => "",
    };
}
