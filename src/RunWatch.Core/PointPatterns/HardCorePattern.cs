using RunWatch.Core.Geometry;

namespace RunWatch.Core.PointPatterns;

/// <summary>Result of a hard-core simulation.</summary>
/// <param name="Points">Accepted sites, no two closer than the minimum distance.</param>
/// <param name="RequestedCount">Sites asked for (density × area, rounded).</param>
/// <param name="Attempts">Candidate sites drawn.</param>
/// <param name="ReachedTarget">False when the attempt budget ran out first (the density is near or above the jamming limit, about 0.547·4/(π·d²) for random sequential adsorption).</param>
public sealed record HardCorePattern(Point2D[] Points, int RequestedCount, long Attempts, bool ReachedTarget);
