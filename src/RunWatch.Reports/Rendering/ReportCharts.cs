using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using ScottPlot;

namespace RunWatch.Reports.Rendering;

/// <summary>Builds the report's charts with ScottPlot. Not thread-safe per plot; each call makes its own plots.</summary>
internal static class ReportCharts
{
    private const int Width = 760;
    private const int Height = 330;

    /// <summary>Temperature against time with the growth window shaded and excursions marked.</summary>
    public static ReportChart Thermal(ThermalSummary thermal)
    {
        using Plot plot = NewPlot();
        int n = Math.Min(thermal.TimesS.Count, thermal.TemperaturesC.Count);
        var minutes = new double[n];
        var temps = new double[n];
        for (int i = 0; i < n; i++)
        {
            minutes[i] = thermal.TimesS[i] / 60;
            temps[i] = thermal.TemperaturesC[i];
        }
        var window = plot.Add.HorizontalSpan(thermal.GrowthWindowStartS / 60, thermal.GrowthWindowEndS / 60);
        window.FillStyle.Color = Colors.SteelBlue.WithAlpha(0.15);
        window.LegendText = "growth window";
        foreach (ExcursionRow e in thermal.Excursions)
        {
            var span = plot.Add.HorizontalSpan(e.StartS / 60, Math.Max(e.EndS, e.StartS + 1) / 60);
            span.FillStyle.Color = Colors.OrangeRed.WithAlpha(0.35);
            span.LineStyle.Width = 0;
        }
        if (n > 0)
        {
            var line = plot.Add.ScatterLine(minutes, temps);
            line.LineWidth = 1.5f;
            line.Color = Colors.Black;
            line.LegendText = "substrate";
        }
        if (thermal.SetpointC is { } setpoint)
        {
            var sp = plot.Add.HorizontalLine(setpoint);
            sp.LinePattern = LinePattern.Solid; // solid: Skia's SVG canvas cannot draw dashes
            sp.Color = Colors.Gray;
            sp.LegendText = "setpoint";
        }
        plot.XLabel("time since run start (min)");
        plot.YLabel("substrate temperature (°C)");
        plot.Title("Thermal record");
        plot.ShowLegend(Alignment.LowerRight);
        return Render(plot, "Thermal record");
    }

    /// <summary>
    /// Histogram of measured radii (bin count by the square-root rule, 5 to 30), with the before-SEM prediction's
    /// 5–95 % band and mean when there is one.
    /// </summary>
    public static ReportChart RadiusHistogram(IReadOnlyList<WireRow> wires, RadiusPrediction? prediction = null)
    {
        using Plot plot = NewPlot();
        if (prediction is not null)
        {
            var band = plot.Add.HorizontalSpan(prediction.P05Nm, prediction.P95Nm);
            band.FillStyle.Color = Colors.OrangeRed.WithAlpha(0.12);
            band.LineStyle.Width = 0;
            band.LegendText = "predicted 5–95 %";
            plot.ShowLegend(Alignment.UpperLeft);
        }
        double min = double.PositiveInfinity;
        double max = double.NegativeInfinity;
        foreach (WireRow w in wires)
        {
            min = Math.Min(min, w.RadiusNm);
            max = Math.Max(max, w.RadiusNm);
        }
        if (wires.Count > 0)
        {
            int bins = Math.Clamp((int)Math.Ceiling(Math.Sqrt(wires.Count)), 5, 30);
            double width = max > min ? (max - min) / bins : 1;
            var counts = new double[bins];
            foreach (WireRow w in wires)
            {
                counts[Math.Min((int)((w.RadiusNm - min) / width), bins - 1)]++;
            }
            var bars = new List<Bar>(bins);
            for (int i = 0; i < bins; i++)
            {
                bars.Add(new Bar { Position = min + ((i + 0.5) * width), Value = counts[i], Size = width * 0.95, FillColor = Colors.SteelBlue });
            }
            plot.Add.Bars(bars);
            plot.Axes.Margins(bottom: 0);
        }
        if (prediction is not null)
        {
            // Drawn after the bars so the line stays visible over them.
            var mean = plot.Add.VerticalLine(prediction.MeanRadiusNm);
            mean.Color = Colors.OrangeRed;
            mean.LinePattern = LinePattern.Solid; // solid: Skia's SVG canvas cannot draw dashes
            mean.LineWidth = 2;
            mean.LegendText = "predicted mean";
        }
        plot.XLabel("radius (nm)");
        plot.YLabel("wires");
        plot.Title("Radius distribution");
        return Render(plot, "Radius distribution");
    }

    /// <summary>Measured radius against normalised capture area, with the model curve.</summary>
    public static ReportChart RadiusVersusArea(IReadOnlyList<WireRow> wires, RadiusModelFit? model, double captureRadiusNm)
    {
        using Plot plot = NewPlot();
        var xs = new List<double>(wires.Count);
        var ys = new List<double>(wires.Count);
        foreach (WireRow w in wires)
        {
            if (double.IsFinite(w.NormalisedArea))
            {
                xs.Add(w.NormalisedArea);
                ys.Add(w.RadiusNm);
            }
        }
        if (xs.Count > 0)
        {
            var points = plot.Add.ScatterPoints(xs.ToArray(), ys.ToArray());
            points.MarkerSize = 4;
            points.Color = Colors.SteelBlue.WithAlpha(0.7);
            points.LegendText = "measured wires";
        }
        if (model is not null)
        {
            const int Samples = 100;
            var fx = new double[Samples];
            var fy = new double[Samples];
            for (int i = 0; i < Samples; i++)
            {
                fx[i] = 0.01 + (0.99 * i / (Samples - 1));
                fy[i] = model.Predict(fx[i]);
            }
            var curve = plot.Add.ScatterLine(fx, fy);
            curve.Color = Colors.OrangeRed;
            curve.LineWidth = 2;
            curve.LegendText = model.Formula() + System.FormattableString.Invariant($"  (r² {model.RSquared:0.000})");
            plot.ShowLegend(Alignment.LowerRight);
        }
        plot.XLabel(System.FormattableString.Invariant($"normalised capture area Â  (L = {captureRadiusNm:0} nm)"));
        plot.YLabel("radius (nm)");
        plot.Title("Radius against capture area");
        return Render(plot, "Radius against capture area");
    }

    /// <summary>Predicted against measured radius with the identity line.</summary>
    public static ReportChart PredictedVersusMeasured(IReadOnlyList<WireRow> wires)
    {
        using Plot plot = NewPlot();
        var xs = new List<double>(wires.Count);
        var ys = new List<double>(wires.Count);
        double lo = double.PositiveInfinity;
        double hi = double.NegativeInfinity;
        foreach (WireRow w in wires)
        {
            if (double.IsFinite(w.PredictedRadiusNm))
            {
                xs.Add(w.RadiusNm);
                ys.Add(w.PredictedRadiusNm);
                lo = Math.Min(lo, Math.Min(w.RadiusNm, w.PredictedRadiusNm));
                hi = Math.Max(hi, Math.Max(w.RadiusNm, w.PredictedRadiusNm));
            }
        }
        if (xs.Count > 0)
        {
            var identity = plot.Add.Line(lo, lo, hi, hi);
            identity.LinePattern = LinePattern.Solid; // solid: Skia's SVG canvas cannot draw dashes
            identity.Color = Colors.Gray;
            identity.LegendText = "predicted = measured";
            var points = plot.Add.ScatterPoints(xs.ToArray(), ys.ToArray());
            points.MarkerSize = 4;
            points.Color = Colors.SeaGreen.WithAlpha(0.7);
            points.LegendText = "wires";
            plot.ShowLegend(Alignment.UpperLeft);
        }
        plot.XLabel("measured radius (nm)");
        plot.YLabel("predicted radius (nm)");
        plot.Title("Predicted against measured");
        return Render(plot, "Predicted against measured");
    }

    private static Plot NewPlot()
    {
        ReportFonts.EnsureLoaded();
        var plot = new Plot();
        plot.Font.Set(ReportFonts.Sans);
        return plot;
    }

    private static ReportChart Render(Plot plot, string title)
    {
        string svg = plot.GetSvgXml(Width, Height);
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        if (start > 0)
        {
            svg = svg[start..];
        }
        // Twice the pixels at twice the scale: the same layout, sharp when printed.
        plot.ScaleFactor = 2;
        byte[] png = plot.GetImageBytes(Width * 2, Height * 2, ImageFormat.Png);
        plot.ScaleFactor = 1;
        return new ReportChart(title, svg, png, Width, Height);
    }
}
