namespace RunWatch.Core.Model.Diffusion;

/// <summary>Convergence settings of <see cref="ScreenedDiffusionSolver"/>.</summary>
public sealed class DiffusionSolverOptions
{
    /// <summary>Stop when ‖b − A·u‖₂ ≤ Tolerance·‖b‖₂.</summary>
    /// <value>1e-10.</value>
    public double RelativeTolerance { get; init; } = 1e-10;

    /// <summary>Iteration limit; reaching it throws.</summary>
    /// <value>20,000.</value>
    public int MaxIterations { get; init; } = 20_000;

    /// <summary>
    /// Share of the dropped fill-in moved to the diagonal in the modified incomplete Cholesky preconditioner
    /// (0 = plain IC(0), 1 = fully modified). Slightly below 1 keeps the factor safely positive.
    /// </summary>
    /// <value>0.97.</value>
    public double Relaxation { get; init; } = 0.97;

    /// <summary>The problems with these options (empty when valid).</summary>
    public IReadOnlyList<string> Validate()
    {
        var problems = new List<string>();
        if (!(RelativeTolerance > 0 && RelativeTolerance < 1))
        {
            problems.Add($"RelativeTolerance must lie in (0, 1) (got {RelativeTolerance}).");
        }
        if (MaxIterations < 1)
        {
            problems.Add($"MaxIterations must be at least 1 (got {MaxIterations}).");
        }
        if (!(Relaxation >= 0 && Relaxation <= 1))
        {
            problems.Add($"Relaxation must lie in [0, 1] (got {Relaxation}).");
        }
        return problems;
    }
}
