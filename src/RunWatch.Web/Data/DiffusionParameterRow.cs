namespace RunWatch.Web.Data;

/// <summary>One fitted parameter of a diffusion radius model with its 95 % profile-likelihood interval.</summary>
/// <param name="Name">Plain name (λ at the reference temperature, λ₀², E_λ, κ, r₀).</param>
/// <param name="Value">Estimate.</param>
/// <param name="Lower95">Lower bound.</param>
/// <param name="Upper95">Upper bound.</param>
/// <param name="Unit">Unit.</param>
public sealed record DiffusionParameterRow(string Name, double Value, double Lower95, double Upper95, string Unit);
