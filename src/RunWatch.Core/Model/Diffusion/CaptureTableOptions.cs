namespace RunWatch.Core.Model.Diffusion;

/// <summary>How <see cref="CaptureAreaTable"/> samples a field's capture areas over λ (lengths in µm).</summary>
public sealed class CaptureTableOptions
{
    /// <summary>Cell side; at most a quarter of the smallest λ (the cell is shrunk to that when needed).</summary>
    /// <value>0.02 µm (20 nm).</value>
    public double CellSizeUm { get; init; } = 0.02;

    /// <summary>Ratio between neighbouring λ nodes where the field is solved.</summary>
    /// <value>1.3.</value>
    public double NodeRatio { get; init; } = 1.3;

    /// <summary>
    /// A wire is guarded (its collection depends on what lies outside the image) when the absorbing and saturated
    /// borders, which bound every possible surrounding, give capture areas further apart than this share of their mean.
    /// </summary>
    /// <value>0.02.</value>
    public double GuardTolerance { get; init; } = 0.02;

    /// <summary>
    /// Solve the bounding borders at every node (true), or only at the largest (false: cheaper, and every node is
    /// then judged by the largest node's bounds, which are the widest, so no wire is wrongly left unguarded).
    /// </summary>
    /// <value>true.</value>
    public bool BoundsAtEveryNode { get; init; } = true;

    /// <summary>Where the capture areas come from.</summary>
    /// <value><see cref="CaptureAreaMethod.Diffusion"/>.</value>
    public CaptureAreaMethod Method { get; init; } = CaptureAreaMethod.Diffusion;

    /// <summary>Solver settings.</summary>
    public DiffusionSolverOptions Solver { get; init; } = new() { RelativeTolerance = 1e-9 };

    /// <summary>Solves run in parallel up to this many at a time (0 = one per processor).</summary>
    public int MaxDegreeOfParallelism { get; init; }

    /// <summary>The problems with these options (empty when valid).</summary>
    public IReadOnlyList<string> Validate()
    {
        var problems = new List<string>();
        if (!(CellSizeUm > 0) || !double.IsFinite(CellSizeUm))
        {
            problems.Add($"CellSizeUm must be a positive number (got {CellSizeUm}).");
        }
        if (!(NodeRatio > 1.01 && NodeRatio <= 2))
        {
            problems.Add($"NodeRatio must lie in (1.01, 2] (got {NodeRatio}).");
        }
        if (!(GuardTolerance > 0 && GuardTolerance < 1))
        {
            problems.Add($"GuardTolerance must lie in (0, 1) (got {GuardTolerance}).");
        }
        if (MaxDegreeOfParallelism < 0)
        {
            problems.Add($"MaxDegreeOfParallelism must be 0 or more (got {MaxDegreeOfParallelism}).");
        }
        if (!Enum.IsDefined(Method))
        {
            problems.Add($"Unknown Method {Method}.");
        }
        problems.AddRange(Solver.Validate());
        return problems;
    }
}
