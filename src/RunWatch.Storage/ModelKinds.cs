namespace RunWatch.Storage;

/// <summary>
/// The kinds of stored model fit (<see cref="ModelFitRecord.Model"/>). Defined here once: the wafer room writes
/// them, the dashboard and the executable read them.
/// </summary>
public static class ModelKinds
{
    /// <summary>A process's radius model (radius against the normalised capture area).</summary>
    public const string Radius = "radius";

    /// <summary>A wafer's best-fit capture radius: one point of the Arrhenius calibration.</summary>
    public const string CaptureRadius = "capture-radius";

    /// <summary>A process's Arrhenius calibration (Ea, D0).</summary>
    public const string Arrhenius = "arrhenius";

    /// <summary>
    /// A process's diffusion radius model (λ₀², E_λ, κ, r₀ with intervals, and the process's wire density); its
    /// parameters are Core <c>DiffusionModelParams</c>. Once accepted, run-end evaluations use it.
    /// </summary>
    public const string Diffusion = "diffusion";

    /// <summary>
    /// A diffusion-model refit that the data could not support: its parameters are Core <c>DiffusionFitResult</c> with no
    /// model and the refusal's plain reason (one temperature, a flat profile, every wire Voronoi-limited, ...). Shown on
    /// the Process model screen; never accepted.
    /// </summary>
    public const string DiffusionRefusal = "diffusion-refusal";
}
