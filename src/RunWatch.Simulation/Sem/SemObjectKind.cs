namespace RunWatch.Simulation.Sem;

/// <summary>What the generator drew at a place.</summary>
public enum SemObjectKind
{
    /// <summary>A vertical wire seen end-on: a bright hexagonal top with its droplet.</summary>
    Vertical,

    /// <summary>A tilted wire seen side-on: a bright elongated stadium.</summary>
    Tilted,

    /// <summary>A parasitic cluster: an irregular union of discs.</summary>
    Parasitic,
}
