using RunWatch.Core.Model.Diffusion;

namespace RunWatch.Web.Data;

/// <summary>An accepted diffusion model of a process, with who accepted it and when.</summary>
/// <param name="Id">Model record id.</param>
/// <param name="Model">The fitted model, with its calibrated temperature and time range.</param>
/// <param name="AcceptedBy">Who accepted it.</param>
/// <param name="AcceptedAt">When.</param>
/// <param name="WireDensityPerUm2">The process's wire density stored with the model (per µm²).</param>
public sealed record AcceptedDiffusionModel(long Id, DiffusionRadiusModel Model, string? AcceptedBy, DateTimeOffset? AcceptedAt, double WireDensityPerUm2);
