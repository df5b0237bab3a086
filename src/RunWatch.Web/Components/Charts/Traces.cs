using Plotly.Blazor;
using Plotly.Blazor.Traces;
using Plotly.Blazor.Traces.ScatterLib;

namespace RunWatch.Web.Components.Charts;

/// <summary>
/// Small builders for the non-time charts. Points with a value that is not finite (a wire left out of the capture-zone
/// statistics has no normalised area) are dropped: plotly's JSON cannot carry NaN or infinity, and one such value
/// would end the page's circuit.
/// </summary>
public static class Traces
{
    public static ITrace Points(string name, IEnumerable<double> x, IEnumerable<double> y, string color)
    {
        var xs = new List<object>();
        var ys = new List<object>();
        foreach (var (a, b) in x.Zip(y))
        {
            if (double.IsFinite(a) && double.IsFinite(b))
            {
                xs.Add(a);
                ys.Add(b);
            }
        }
        return new Scatter
        {
            Name = name,
            X = xs,
            Y = ys,
            Mode = ModeFlag.Markers,
            Marker = new Marker { Color = color, Size = 6, Opacity = 0.7m },
        };
    }

    public static ITrace Line(string name, IEnumerable<double> x, IEnumerable<double> y, string color, string dash = "solid") => new Scatter
    {
        Name = name,
        X = x.Cast<object>().ToList(),
        Y = y.Cast<object>().ToList(),
        Mode = ModeFlag.Lines,
        Line = new Line { Color = color, Width = 2, Dash = dash },
    };

    public static ITrace Histogram(string name, IEnumerable<double> values, string color) => new Histogram
    {
        Name = name,
        X = values.Where(double.IsFinite).Cast<object>().ToList(),
        Marker = new Plotly.Blazor.Traces.HistogramLib.Marker { Color = color },
    };
}
