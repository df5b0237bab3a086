namespace RunWatch.Core.Model;

/// <summary>Stopping rules for the Levenberg–Marquardt power-law fit.</summary>
public sealed record PowerLawFitOptions
{
    /// <summary>Maximum number of Levenberg–Marquardt iterations.</summary>
    /// <value>200</value>
    public int MaxIterations { get; init; } = 200;

    /// <summary>Stop when a step changes every parameter by less than this fraction of its magnitude.</summary>
    /// <value>1e-12</value>
    public double RelativeStepTolerance { get; init; } = 1e-12;

    /// <summary>Throws <see cref="ArgumentException"/> when a setting is out of range.</summary>
    public void Validate()
    {
        if (MaxIterations < 1)
        {
            throw new ArgumentException($"MaxIterations must be ≥ 1; got {MaxIterations}.");
        }
        if (!(RelativeStepTolerance > 0) || !double.IsFinite(RelativeStepTolerance))
        {
            throw new ArgumentException($"RelativeStepTolerance must be a positive number; got {RelativeStepTolerance}.");
        }
    }

    /// <summary>The default options.</summary>
    public static PowerLawFitOptions Default { get; } = new();
}
