using Microsoft.Extensions.Logging;
using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Storage;

namespace RunWatch.Ingest.Runs;

/// <summary>
/// Accepted <see cref="ModelKinds.Diffusion"/> records from the wafer store. A proposal counts only once a person has
/// accepted it; an unreadable record is logged and skipped (the next older accepted one is used).
/// </summary>
internal sealed class StoredRunDiffusionModels(IWaferStore? wafers, ILogger<StoredRunDiffusionModels> logger) : IRunDiffusionModels
{
    public async ValueTask<(long Id, DiffusionModelParams Params)?> AcceptedForAsync(string process, CancellationToken cancellationToken)
    {
        if (wafers is null || string.IsNullOrWhiteSpace(process))
        {
            return null;
        }
        foreach (ModelFitRecord fit in await wafers.GetModelFitsAsync(process, ModelKinds.Diffusion, 50, cancellationToken).ConfigureAwait(false))
        {
            if (fit.AcceptedAt is null)
            {
                continue;
            }
            try
            {
                DiffusionModelParams p = ModelJson.Deserialize<DiffusionModelParams>(fit.ParamsJson);
                if (p.Model is { Lambda0SquaredUm2: > 0, KappaNm2PerUm2S: > 0 } && p.WireDensityPerUm2 > 0 && double.IsFinite(p.WireDensityPerUm2))
                {
                    return (fit.Id, p);
                }
                Log.DiffusionModelSkipped(logger, fit.Id, process, "non-positive parameters");
            }
            catch (JsonException ex)
            {
                Log.DiffusionModelSkipped(logger, fit.Id, process, ex.Message);
            }
        }
        return null;
    }
}
