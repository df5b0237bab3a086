namespace RunWatch.Web.Data;

/// <summary>The planner's diffusion-model what-if: the process's accepted diffusion model applied to a planned run.</summary>
public interface IGrowthPlanEngine
{
    /// <summary>
    /// Plans <paramref name="process"/> at <paramref name="temperatureC"/> (true, °C) for <paramref name="growthMinutes"/>
    /// at <paramref name="densityPerUm2"/>. Without an accepted diffusion model the result carries no model and no plan.
    /// </summary>
    /// <exception cref="ArgumentException">Inputs out of range, with a plain message.</exception>
    Task<GrowthPlanView> PlanAsync(string process, double temperatureC, double growthMinutes, double densityPerUm2, CancellationToken cancellationToken);
}
