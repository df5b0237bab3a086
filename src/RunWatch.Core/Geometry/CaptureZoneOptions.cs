namespace RunWatch.Core.Geometry;

/// <summary>Settings for <see cref="CaptureZones.Compute"/>. Immutable; safe to share between threads.</summary>
public sealed record CaptureZoneOptions
{
    /// <summary>
    /// Diffusion length L, in the points' unit: a zone is the Voronoi cell ∩ disc of radius L ∩ field.
    /// <see cref="double.PositiveInfinity"/> gives plain Voronoi cells clipped to the field.
    /// </summary>
    /// <value>Default +∞.</value>
    public double DiffusionLength { get; init; } = double.PositiveInfinity;

    /// <summary>Which zones are flagged as guarded.</summary>
    /// <value>Default <see cref="GuardRule.DiscCrossesEdge"/> (the design notes' rule).</value>
    public GuardRule GuardRule { get; init; } = GuardRule.DiscCrossesEdge;

    /// <summary>Whether to return each zone's outline (for overlays). Costs memory, little time.</summary>
    /// <value>Default false.</value>
    public bool IncludeOutlines { get; init; }

    /// <summary>Largest angle between outline vertices along a circular arc of a zone, in degrees.</summary>
    /// <value>Default 10°.</value>
    public double OutlineArcStepDegrees { get; init; } = 10.0;

    /// <summary>Threads to use; 0 means all processors. Small inputs run on one thread regardless.</summary>
    /// <value>Default 0.</value>
    public int MaxDegreeOfParallelism { get; init; }

    /// <summary>Throws <see cref="ArgumentException"/> when a setting is out of range.</summary>
    public void Validate()
    {
        if (double.IsNaN(DiffusionLength) || !(DiffusionLength > 0.0))
        {
            throw new ArgumentException($"diffusion length must be > 0 or +∞ (got {DiffusionLength})");
        }
        if (!double.IsFinite(OutlineArcStepDegrees) || OutlineArcStepDegrees <= 0.0 || OutlineArcStepDegrees > 90.0)
        {
            throw new ArgumentException($"outline arc step must be in (0, 90] degrees (got {OutlineArcStepDegrees})");
        }
        if (!Enum.IsDefined(GuardRule))
        {
            throw new ArgumentException($"unknown guard rule {GuardRule}");
        }
        if (MaxDegreeOfParallelism < 0)
        {
            throw new ArgumentException($"max degree of parallelism must be >= 0 (got {MaxDegreeOfParallelism})");
        }
    }
}
