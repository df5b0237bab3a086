using Plotly.Blazor;
using Plotly.Blazor.Traces;
using Plotly.Blazor.Traces.ScatterLib;

namespace RunWatch.Web.Components.Charts;

/// <summary>Small builders for the non-time charts.</summary>
public static class Traces
{
    public static ITrace Points(string name, IEnumerable<double> x, IEnumerable<double> y, string color) => new Scatter
    {
        Name = name,
        X = x.Cast<object>().ToList(),
        Y = y.Cast<object>().ToList(),
        Mode = ModeFlag.Markers,
        Marker = new Marker { Color = color, Size = 6, Opacity = 0.7m },
    };

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
        X = values.Cast<object>().ToList(),
        Marker = new Plotly.Blazor.Traces.HistogramLib.Marker { Color = color },
    };
}
