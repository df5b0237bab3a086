using System.Text.Json;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Storage;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// The planner's diffusion what-if over the store: the newest accepted, readable <see cref="ModelKinds.Diffusion"/>
/// record of the process (a proposal never counts), planned by Core's <see cref="GrowthPlanner"/> on the thread pool
/// (a plan takes about a second of CPU per simulated field). Without a wafer store no process has a model.
/// </summary>
public sealed class StoreGrowthPlanner(IWaferStore? wafers = null) : IGrowthPlanEngine
{
    public async Task<GrowthPlanView> PlanAsync(string process, double temperatureC, double growthMinutes, double densityPerUm2, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(process);
        AcceptedDiffusionModel? accepted = await AcceptedAsync(process, cancellationToken).ConfigureAwait(false);
        if (accepted is null)
        {
            return new GrowthPlanView(process, null, null);
        }
        var request = new GrowthPlanRequest(temperatureC, growthMinutes * 60, densityPerUm2);
        PlannedRadii plan = await Task.Run(() => GrowthPlanner.Plan(accepted.Model, request), cancellationToken).ConfigureAwait(false);
        return new GrowthPlanView(process, accepted, plan);
    }

    private async Task<AcceptedDiffusionModel?> AcceptedAsync(string process, CancellationToken cancellationToken)
    {
        if (wafers is null || process.Length == 0)
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
                if (p.Model is { Lambda0SquaredUm2: > 0, KappaNm2PerUm2S: > 0 })
                {
                    return new AcceptedDiffusionModel(fit.Id, p.Model, fit.AcceptedBy, fit.AcceptedAt, p.WireDensityPerUm2);
                }
            }
            catch (JsonException)
            {
                // An unreadable record is skipped; the next older accepted one is used (as at run end).
            }
        }
        return null;
    }
}
