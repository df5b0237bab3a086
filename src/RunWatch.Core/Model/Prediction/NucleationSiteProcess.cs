namespace RunWatch.Core.Model.Prediction;

/// <summary>How simulated nucleation sites are placed.</summary>
public enum NucleationSiteProcess
{
    /// <summary>Poisson point process (complete spatial randomness).</summary>
    Poisson,

    /// <summary>Hard-core: random sequential adsorption with a minimum site distance.</summary>
    HardCore,
}
