using RunWatch.Core.Geometry;

namespace RunWatch.Simulation.Growth;

/// <summary>The true outcome of a simulated growth on one periodic substrate (invented demo data).</summary>
/// <param name="SitesUm">Wire centres (µm).</param>
/// <param name="RadiiNm">Final radius of each wire (nm).</param>
/// <param name="AreaTimeUm2S">Substrate area-time each wire collected (µm²·s): its ∫A dt.</param>
/// <param name="SeedRadiiNm">Each wire's radius before it collected (nm).</param>
/// <param name="NucleationS">When each wire started to collect (s on the history's axis).</param>
/// <param name="Launched">Adatoms launched.</param>
/// <param name="Caught">Adatoms caught by a wire.</param>
/// <param name="Desorbed">Adatoms that desorbed.</param>
public sealed record GrownWires(
    IReadOnlyList<Point2D> SitesUm,
    IReadOnlyList<double> RadiiNm,
    IReadOnlyList<double> AreaTimeUm2S,
    IReadOnlyList<double> SeedRadiiNm,
    IReadOnlyList<double> NucleationS,
    long Launched,
    long Caught,
    long Desorbed);
