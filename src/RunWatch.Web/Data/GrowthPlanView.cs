using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Web.Data;

/// <summary>What the planner shows for the diffusion model: the accepted model (null when none) and its plan.</summary>
/// <param name="Process">Process planned for.</param>
/// <param name="Model">The accepted diffusion model, or null when the process has none.</param>
/// <param name="Plan">The predicted radius distribution, or null without a model.</param>
public sealed record GrowthPlanView(string Process, AcceptedDiffusionModel? Model, PlannedRadii? Plan);
