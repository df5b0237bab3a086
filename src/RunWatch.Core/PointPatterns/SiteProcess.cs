namespace RunWatch.Core.PointPatterns;

/// <summary>Random process that places simulated nucleation sites.</summary>
public enum SiteProcess
{
    /// <summary>Complete spatial randomness.</summary>
    Poisson,

    /// <summary>Hard-core random sequential adsorption (sites no closer than the minimum distance).</summary>
    RandomSequentialAdsorption,

    /// <summary>Matérn type II hard-core thinning of a denser Poisson pattern.</summary>
    MaternHardCore,
}
