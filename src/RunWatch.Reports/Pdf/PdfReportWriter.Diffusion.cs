using System.Globalization;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Model;
using static RunWatch.Reports.Rendering.ReportFormat;

namespace RunWatch.Reports.Pdf;

/// <summary>The diffusion radius model's part of the report's model section.</summary>
public static partial class PdfReportWriter
{
    private static void DiffusionModel(PdfLayout page, DiffusionModelFigures d)
    {
        WaferDiffusionFigures f = d.Figures;
        page.Paragraph((f.Method == Core.Model.Diffusion.CaptureAreaMethod.VoronoiDisc
            ? "Capture-length model with Voronoi ∩ disc(λ) capture areas"
            : "Diffusion model: r² = r₀² + κ·∫A(λ(T(t)))dt, capture areas from the adatom diffusion field with desorption")
            + " (model record " + d.ModelFitId.ToString(CultureInfo.InvariantCulture) + ").");
        var rows = new List<string[]>();
        foreach (var (name, value, interval, unit) in d.ParameterRows())
        {
            rows.Add([name, value, interval, unit]);
        }
        page.Table(["Parameter", "Estimate", "95 % interval (profile likelihood)", "Unit"], rows, [0.22f, 0.2f, 0.42f, 0.16f]);
        page.KeyValues([
            ("Mean growth temperature", Number(f.MeanTemperatureC, "0.0") + " °C over " + Number(f.CoveredS, "0") + " s"),
            ("λ; λ_eff", Number(f.LambdaAtMeanUm * 1000, "0") + " nm at that temperature; " + Number(f.LambdaEffUm * 1000, "0") + " nm over the real history (range "
                + Number(f.LambdaMinUm * 1000, "0") + " to " + Number(f.LambdaMaxUm * 1000, "0") + " nm)"),
            ("Wires predicted", f.PredictedWires.ToString(CultureInfo.InvariantCulture) + " (" + f.GuardedWires.ToString(CultureInfo.InvariantCulture) + " near the field edges left out)"),
            ("Calibrated range", Number(d.Model.CalibratedMinC, "0.0") + " to " + Number(d.Model.CalibratedMaxC, "0.0") + " °C, " + Number(d.Model.CalibratedMinS, "0") + " to "
                + Number(d.Model.CalibratedMaxS, "0") + " s" + (f.Extrapolated ? "; this wafer lies outside it (extrapolated)" : "")),
            ("Expected at run end (before SEM)", d.RunEndMeanRadiusNm is { } m ? Number(m, "0.0") + " ± " + Number(d.RunEndRadiusSdNm, "0.0") + " nm (simulated sites)" : "not estimated for this run"),
        ]);
    }
}
