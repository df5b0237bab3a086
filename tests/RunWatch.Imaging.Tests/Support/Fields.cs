using RunWatch.Simulation.Sem;

namespace RunWatch.Imaging.Tests.Support;

/// <summary>Generated test fields (invented data), seeded.</summary>
internal static class Fields
{
    public static SemField Standard(int seed = 7, int width = 1024, int height = 768, int sites = 900, double touching = 0.08, int strip = 48)
    {
        IReadOnlyList<(double X, double Y)> points = SemSites.Scatter(width, height - strip, sites, 24, touching, 14, seed, margin: 2);
        var random = new Random(seed);
        var sides = new double[points.Count];
        for (int i = 0; i < sides.Length; i++)
        {
            sides[i] = 7 + 2 * random.NextDouble();
        }
        return SemFieldGenerator.Generate(new SemFieldSpec
        {
            Width = width,
            Height = height,
            Seed = seed,
            Sites = points,
            SideOfSite = i => sides[i],
            InfoStripRows = strip,
            PixelSizeNm = 5,
        });
    }
}
