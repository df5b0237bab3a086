using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Wafers;

namespace RunWatch.Reports.Model;

/// <summary>The diffusion radius model a wafer was judged with and what it made of the wafer (λ, λ_eff, counts).</summary>
/// <param name="ModelFitId">The accepted model record used.</param>
/// <param name="Model">The model with its profile-likelihood intervals.</param>
/// <param name="Figures">λ at the mean temperature, λ_eff and the wires predicted.</param>
/// <param name="RunEndMeanRadiusNm">The run-end expectation of the mean radius (before SEM, simulated sites), when the run has one.</param>
/// <param name="RunEndRadiusSdNm">Its wire-to-wire SD.</param>
public sealed record DiffusionModelFigures(long ModelFitId, DiffusionRadiusModel Model, WaferDiffusionFigures Figures, double? RunEndMeanRadiusNm = null,
    double? RunEndRadiusSdNm = null)
{
    /// <summary>Rows of (name, value, 95 % interval, unit) for the model's parameters, with λ at the reference temperature.</summary>
    public IReadOnlyList<(string Name, string Value, string Interval, string Unit)> ParameterRows()
    {
        var rows = new List<(string, string, string, string)>();
        foreach (Core.Model.ParameterEstimate p in Model.Parameters)
        {
            rows.Add((Label(p.Name), Rendering.ReportFormat.Number(p.Value, "0.####"),
                Rendering.ReportFormat.Number(p.Lower95, "0.####") + " to " + Rendering.ReportFormat.Number(p.Upper95, "0.####"), p.Unit));
        }
        return rows;
    }

    /// <summary>A plain name for a fitted parameter's stored name.</summary>
    public string Label(string name) => name switch
    {
        "lambda_ref" => $"λ at {Core.Thermal.PhysicalConstants.KelvinToCelsius(Model.ReferenceTemperatureK):0.#} °C",
        "lambda0_squared" => "λ₀²",
        "E_lambda" => "E_λ",
        "kappa" => "κ",
        "r0" => "r₀",
        _ => name,
    };
}
