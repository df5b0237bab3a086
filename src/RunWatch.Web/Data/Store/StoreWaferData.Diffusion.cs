using System.Globalization;
using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Storage;

namespace RunWatch.Web.Data.Store;

/// <summary>The diffusion radius model on the Process model and wafer screens.</summary>
public sealed partial class StoreWaferData
{
    /// <summary>The process's diffusion model in force, a newer proposal and a newer refusal; null when none was ever fitted or refused.</summary>
    private async Task<DiffusionModelView?> DiffusionModelAsync(string process, CancellationToken cancellationToken)
    {
        var fits = await wafers.GetModelFitsAsync(process, ModelKinds.Diffusion, 50, cancellationToken).ConfigureAwait(false);
        var refusals = await wafers.GetModelFitsAsync(process, ModelKinds.DiffusionRefusal, 5, cancellationToken).ConfigureAwait(false);
        if (fits.Count == 0 && refusals.Count == 0)
        {
            return null;
        }
        var (accepted, proposed) = AcceptedAndProposed(fits);
        ModelFitRecord? refusal = refusals.FirstOrDefault();
        string? reason = null;
        if (refusal is not null && (accepted is null || refusal.FittedAt >= accepted.FittedAt) && (proposed is null || refusal.FittedAt >= proposed.FittedAt))
        {
            reason = ReadRefusal(refusal.ParamsJson);
        }
        return new DiffusionModelView(accepted is null ? null : ToDiffusionFit(accepted), accepted?.AcceptedBy, accepted?.AcceptedAt,
            proposed is null ? null : ToDiffusionFit(proposed), reason, reason is null ? null : refusal!.FittedAt);
    }

    private static string ReadRefusal(string json)
    {
        try
        {
            return ModelJson.Deserialize<DiffusionFitResult>(json).Refusal ?? "refused (no reason recorded)";
        }
        catch (JsonException)
        {
            return "refused (the stored record cannot be read)";
        }
    }

    private static DiffusionModelFit? ToDiffusionFit(ModelFitRecord record)
    {
        DiffusionModelParams p;
        try
        {
            p = ModelJson.Deserialize<DiffusionModelParams>(record.ParamsJson);
        }
        catch (JsonException)
        {
            return null;
        }
        DiffusionRadiusModel m = p.Model;
        double referenceC = PhysicalConstants.KelvinToCelsius(m.ReferenceTemperatureK);
        var rows = new List<DiffusionParameterRow>();
        foreach (ParameterEstimate e in m.Parameters)
        {
            rows.Add(new DiffusionParameterRow(Label(e.Name, referenceC), e.Value, e.Lower95, e.Upper95, e.Unit));
        }
        return new DiffusionModelFit(record.Id, record.FittedAt, rows, referenceC, m.Law.LambdaUm(m.ReferenceTemperatureK) * 1000,
            m.CalibratedMinC, m.CalibratedMaxC, m.CalibratedMinS, m.CalibratedMaxS, m.ResidualSdNm, record.Wafers, p.WireDensityPerUm2);
    }

    private static string Label(string name, double referenceC) => name switch
    {
        "lambda_ref" => string.Create(CultureInfo.InvariantCulture, $"λ at {referenceC:0.#} °C"),
        "lambda0_squared" => "λ₀²",
        "E_lambda" => "E_λ",
        "kappa" => "κ",
        "r0" => "r₀",
        _ => name,
    };

    private static string DescribeDiffusion(ModelFitRecord record) => ToDiffusionFit(record) is { } f
        ? string.Join(", ", f.Parameters.Select(p => string.Create(CultureInfo.InvariantCulture, $"{p.Name} {p.Value:G4} [{p.Lower95:G4}, {p.Upper95:G4}] {p.Unit}")))
        : "record " + record.Id.ToString(CultureInfo.InvariantCulture);

    private static WaferDiffusionView? DiffusionOf(WaferReportDigest digest) => digest.Diffusion is { } d
        ? new WaferDiffusionView(d.ModelFitId, d.Method, d.MeanTemperatureC, d.CoveredS, d.LambdaAtMeanNm, d.LambdaEffNm ?? double.NaN, d.LambdaMinNm, d.LambdaMaxNm,
            d.PredictedWires, d.GuardedWires, d.Extrapolated)
        : null;
}
