namespace RunWatch.Core.Model.Diffusion;

/// <summary>Outcome of <see cref="DiffusionModelFitter.Fit"/>: a model, or a plain reason why the data cannot give one.</summary>
/// <param name="Model">The fitted model, null when refused.</param>
/// <param name="Refusal">Why no model was made (null when <see cref="Model"/> is set).</param>
/// <param name="Wafers">Per-wafer figures (at the best parameters found, also when refused after fitting).</param>
/// <param name="Observations">Wires used in total.</param>
public sealed record DiffusionFitResult(DiffusionRadiusModel? Model, string? Refusal, IReadOnlyList<DiffusionWaferFigures> Wafers, int Observations)
{
    /// <summary>True when a model was made.</summary>
    public bool Succeeded => Model is not null;
}
