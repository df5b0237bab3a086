using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Wafers;
using RunWatch.Reports.Json;
using RunWatch.Reports.Model;
using RunWatch.Reports.Tests.Support;
using RunWatch.Testing.Documents;
using Xunit;

namespace RunWatch.Reports.Tests.Model;

/// <summary>The diffusion model's figures in the wafer report (invented numbers): HTML, PDF read back by poppler, JSON.</summary>
public sealed class DiffusionModelFiguresTests
{
    private static DiffusionModelFigures Figures()
    {
        ParameterEstimate[] parameters =
        [
            new("lambda_ref", 0.524, 0.03, 0.471, 0.587, "µm"),
            new("E_lambda", -1.115, 0.08, -1.3, -0.956, "eV"),
            new("kappa", 2.746, 0.1, 2.469, 3.058, "nm²/(µm²·s)"),
            new("r0", 20.53, double.NaN, 18.49, 22.39, "nm"),
        ];
        var model = new DiffusionRadiusModel(1.2e-7, -1.115, 2.746, 421.5, 883.15, parameters, 590, 630, 1200, 2400, 1.5);
        var wafer = new WaferDiffusionFigures(CaptureAreaMethod.Diffusion, 605.2, 1000, 0.5471, 0.5468, 0.4507, 0.5733, 49, 71, Extrapolated: true);
        return new DiffusionModelFigures(17, model, wafer, 36.55, 2.1);
    }

    [Fact]
    public void WriteAll_WithDiffusionModel_HtmlPdfAndJsonShowParametersLambdaAndLambdaEff()
    {
        using var folder = new TempFolder();
        WaferReport report = SampleReport.Build() with { Model = null, Diffusion = Figures() };

        ReportFiles files = WaferReportWriter.WriteAll(report, folder.Path);

        string html = System.Net.WebUtility.HtmlDecode(File.ReadAllText(files.HtmlPath));
        Assert.Contains("λ at 610 °C", html, StringComparison.Ordinal);
        Assert.Contains("-1.3 to -0.956", html, StringComparison.Ordinal);
        Assert.Contains("547 nm", html, StringComparison.Ordinal); // λ_eff 0.5468 µm
        Assert.Contains("extrapolated", html, StringComparison.Ordinal);
        Assert.DoesNotContain("No accepted radius model", html, StringComparison.Ordinal);
        // Real PDF reader (poppler-utils).
        string pdf = PopplerText.Text(files.PdfPath);
        Assert.Contains("E_λ", pdf, StringComparison.Ordinal);
        Assert.Contains("36.6 ± 2.1 nm", pdf, StringComparison.Ordinal);
        WaferReportSummary summary = JsonSummaryWriter.Read(File.ReadAllText(files.JsonPath));
        Assert.Equal(0.5468, summary.Diffusion!.Figures.LambdaEffUm, 1e-12);
        Assert.Equal(17, summary.Diffusion.ModelFitId);
    }
}
