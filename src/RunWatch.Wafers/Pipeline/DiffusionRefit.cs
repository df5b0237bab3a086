using RunWatch.Core.Model.Diffusion;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>What a diffusion-model refit did: the fit (a model, or a refusal with its reason), the record stored, and the wafers it could not use.</summary>
/// <param name="Result">The fitter's result; null when no wafer could enter the fit (<see cref="Reason"/> says why).</param>
/// <param name="Record">The stored proposal (<see cref="ModelKinds.Diffusion"/>) or refusal (<see cref="ModelKinds.DiffusionRefusal"/>); null when nothing was fitted.</param>
/// <param name="Skipped">Wafers left out, each with why (no run, no thermal record, no measured wires).</param>
/// <param name="Reason">Why no model was made, in words; null when one was proposed.</param>
public sealed record DiffusionRefit(DiffusionFitResult? Result, ModelFitRecord? Record, IReadOnlyList<string> Skipped, string? Reason)
{
    /// <summary>True when a model was proposed.</summary>
    public bool Proposed => Result?.Model is not null;
}
