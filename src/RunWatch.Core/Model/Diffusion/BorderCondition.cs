namespace RunWatch.Core.Model.Diffusion;

/// <summary>What the adatom density does at the field's edge and inside an excluded band (cells not seen).</summary>
public enum BorderCondition
{
    /// <summary>Density zero beyond the edge: everything outside is a perfect sink. A lower bound on every wire's collection.</summary>
    Absorbing,

    /// <summary>
    /// Density beyond the edge held at F·τ, the value of a substrate with no wire at all. By the maximum principle no
    /// real surrounding can hold more, so this is an upper bound on every wire's collection (needs a finite λ).
    /// </summary>
    Saturated,

    /// <summary>No flux across the edge (a mirror-image surrounding). An estimate, not a bound.</summary>
    Reflecting,

    /// <summary>The field is a torus (simulated patterns only; never for real images).</summary>
    Periodic,
}
