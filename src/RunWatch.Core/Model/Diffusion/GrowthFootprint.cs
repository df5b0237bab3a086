namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// The footprint a wire collects with, from its measured (final) radius. A wire is thinner for most of its growth
/// than at the end, and a sink's collection depends on its radius (through ln(λ/R) when λ ≫ R), so the final
/// radius overstates what it collected with. RunWatch uses the time-averaged radius of a wire whose r² grows
/// linearly in time from (0.4·r)² to r²: (2/3)·(r³ − r₀³)/(r² − r₀²) with r₀ = 0.4·r, which is 0.75·r (DERIVED;
/// r₀ = 0 would give 2/3, r₀ = r/2 gives 0.78). The share is an assumption of the model, stated in docs/model.md.
/// </summary>
public static class GrowthFootprint
{
    /// <summary>Share of the final radius used as the collecting footprint.</summary>
    public const double ShareOfFinalRadius = 0.75;

    /// <summary>Footprint radius (µm) for a measured final radius in nm.</summary>
    public static double FootprintUm(double finalRadiusNm) => ShareOfFinalRadius * finalRadiusNm / 1000.0;
}
