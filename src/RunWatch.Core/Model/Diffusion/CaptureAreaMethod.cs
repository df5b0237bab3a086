namespace RunWatch.Core.Model.Diffusion;

/// <summary>How <see cref="CaptureAreaTable"/> gets a wire's capture area at a given λ.</summary>
public enum CaptureAreaMethod
{
    /// <summary>The diffusion solution with desorption (the default).</summary>
    Diffusion,

    /// <summary>
    /// The simpler geometric option: the wire's Voronoi cell ∩ the disc of radius λ (geometry room, docs/geometry.md),
    /// guarded by its airtight rule (an unseen wire could cut the zone). Ignores footprints and the diffusion field.
    /// </summary>
    VoronoiDisc,
}
