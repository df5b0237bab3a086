using System.Globalization;

namespace RunWatch.Web.Components.Charts;

/// <summary>A linear map from data values to SVG coordinates, with rounded tick values for the axis.</summary>
public sealed class SvgScale
{
    private readonly double _min;
    private readonly double _max;
    private readonly double _from;
    private readonly double _to;

    /// <summary>Maps [min, max] (widened when empty or flat) onto [from, to] (to may be below from, for y axes).</summary>
    public SvgScale(double min, double max, double from, double to)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max))
        {
            (min, max) = (0, 1);
        }
        if (max - min < 1e-12 * Math.Max(1, Math.Abs(max)))
        {
            double pad = Math.Abs(min) > 0 ? Math.Abs(min) * 0.05 : 1;
            (min, max) = (min - pad, max + pad);
        }
        (_min, _max, _from, _to) = (min, max, from, to);
    }

    public double Min => _min;

    public double Max => _max;

    /// <summary>SVG coordinate of a value.</summary>
    public double this[double value] => _from + ((value - _min) / (_max - _min) * (_to - _from));

    /// <summary>A coordinate as SVG text (invariant, two decimals).</summary>
    public static string S(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);

    /// <summary>About <paramref name="count"/> ticks at 1, 2 or 5 × 10ⁿ steps inside the range.</summary>
    public IReadOnlyList<double> Ticks(int count = 5)
    {
        double raw = (_max - _min) / Math.Max(1, count);
        double magnitude = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = magnitude * (raw / magnitude < 1.5 ? 1 : raw / magnitude < 3.5 ? 2 : raw / magnitude < 7.5 ? 5 : 10);
        var ticks = new List<double>();
        for (double t = Math.Ceiling(_min / step) * step; t <= _max + (step * 1e-9); t += step)
        {
            ticks.Add(Math.Abs(t) < step * 1e-9 ? 0 : t);
        }
        return ticks;
    }

    /// <summary>Range of finite values padded by a fraction on both sides; (0, 1) when there are none.</summary>
    public static (double Min, double Max) Padded(IEnumerable<double> values, double fraction = 0.08)
    {
        double min = double.PositiveInfinity;
        double max = double.NegativeInfinity;
        foreach (double v in values)
        {
            if (double.IsFinite(v))
            {
                min = Math.Min(min, v);
                max = Math.Max(max, v);
            }
        }
        if (!double.IsFinite(min))
        {
            return (0, 1);
        }
        double pad = (max - min) * fraction;
        if (pad <= 0)
        {
            pad = Math.Abs(max) > 0 ? Math.Abs(max) * fraction : 1;
        }
        return (min - pad, max + pad);
    }
}
