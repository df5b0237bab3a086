using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;

namespace RunWatch.Core.Tests.Model.Diffusion;

/// <summary>Seeded wire fields for the diffusion tests (lengths in µm; invented, plausible for self-catalysed wires).</summary>
internal static class DiffusionTestFields
{
    /// <summary>Poisson wire centres with footprint radii uniform in [0.02, 0.05] µm.</summary>
    public static (Point2D[] Centres, double[] Radii) Poisson(CaptureField field, double densityPerUm2, int seed)
    {
        Point2D[] centres = NucleationSites.RandomSequentialAdsorption(field, densityPerUm2, 0.12, seed).Points;
        var random = new Random(seed);
        var radii = new double[centres.Length];
        for (int i = 0; i < radii.Length; i++)
        {
            radii[i] = 0.02 + (0.03 * random.NextDouble());
        }
        return (centres, radii);
    }
}
