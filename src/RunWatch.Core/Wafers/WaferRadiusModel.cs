namespace RunWatch.Core.Wafers;

/// <summary>Which radius model the wafer verdict predicts with (configuration <c>WaferPipeline:RadiusModel</c>).</summary>
public enum WaferRadiusModel
{
    /// <summary>
    /// The default: per wire r² = r₀² + κ·∫A(λ(T(t)))dt, with A from the screened-diffusion solution on the measured
    /// positions and footprints and T(t) the run's stored record (docs/model.md).
    /// </summary>
    Diffusion,

    /// <summary>The same model with A = the wire's Voronoi cell ∩ disc(λ) instead of the diffusion solution (a simpler option).</summary>
    VoronoiDisc,

    /// <summary>The older regression of r on Â = A/(πL²) at the run's L_eff (kept for comparison; it fails across temperatures and times).</summary>
    CaptureAreaRegression,
}
