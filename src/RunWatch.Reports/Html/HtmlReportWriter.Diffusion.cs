using System.Globalization;
using System.Text;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using static RunWatch.Reports.Rendering.ReportFormat;

namespace RunWatch.Reports.Html;

/// <summary>The diffusion radius model's part of the report's model section.</summary>
public static partial class HtmlReportWriter
{
    private static void DiffusionModel(StringBuilder h, DiffusionModelFigures d)
    {
        WaferDiffusionFigures f = d.Figures;
        h.Append("<p>").Append(E(f.Method == Core.Model.Diffusion.CaptureAreaMethod.VoronoiDisc
            ? "Capture-length model with Voronoi ∩ disc(λ) capture areas"
            : "Diffusion model: r² = r₀² + κ·∫A(λ(T(t)))dt, capture areas from the adatom diffusion field with desorption"))
            .Append(" (model record ").Append(d.ModelFitId.ToString(CultureInfo.InvariantCulture)).Append(").</p>\n");
        h.Append("<table>\n<thead><tr><th>Parameter</th><th>Estimate</th><th>95 % interval (profile likelihood)</th><th>Unit</th></tr></thead>\n<tbody>\n");
        foreach (var (name, value, interval, unit) in d.ParameterRows())
        {
            h.Append("<tr><td>").Append(E(name)).Append("</td><td>").Append(E(value)).Append("</td><td>").Append(E(interval)).Append("</td><td>").Append(E(unit)).Append("</td></tr>\n");
        }
        h.Append("</tbody>\n</table>\n");
        KeyValues(h, [
            ("Mean growth temperature", Number(f.MeanTemperatureC, "0.0") + " °C over " + Number(f.CoveredS, "0") + " s"),
            ("λ at that temperature", Number(f.LambdaAtMeanUm * 1000, "0") + " nm"),
            ("λ_eff over the real history", Number(f.LambdaEffUm * 1000, "0") + " nm (range " + Number(f.LambdaMinUm * 1000, "0") + " to " + Number(f.LambdaMaxUm * 1000, "0") + " nm)"),
            ("Wires predicted", f.PredictedWires.ToString(CultureInfo.InvariantCulture) + " (" + f.GuardedWires.ToString(CultureInfo.InvariantCulture) + " near the field edges left out)"),
            ("Calibrated range", Number(d.Model.CalibratedMinC, "0.0") + " to " + Number(d.Model.CalibratedMaxC, "0.0") + " °C, " + Number(d.Model.CalibratedMinS, "0") + " to " + Number(d.Model.CalibratedMaxS, "0") + " s"
                + (f.Extrapolated ? "; this wafer lies outside it (extrapolated)" : "")),
            ("Expected at run end (before SEM)", d.RunEndMeanRadiusNm is { } m ? Number(m, "0.0") + " ± " + Number(d.RunEndRadiusSdNm, "0.0") + " nm (simulated sites at the process's density)" : "not estimated for this run"),
        ]);
        h.Append("</section>\n");
    }
}
