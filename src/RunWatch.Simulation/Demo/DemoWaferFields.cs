using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Imaging.Scale;
using RunWatch.Simulation.Sem;

namespace RunWatch.Simulation.Demo;

/// <summary>
/// Makes the SEM fields of a demo wafer (invented data): random nucleation sites, each wire's capture zone at the
/// run's effective diffusion length, its radius from <see cref="DemoGrowthModel"/>, drawn as a top-down SEM image
/// with a sidecar naming the wafer and the pixel size.
/// </summary>
public static class DemoWaferFields
{
    /// <summary>Writes <paramref name="fieldCount"/> fields of wafer <paramref name="waferId"/> into <paramref name="folder"/>; returns their paths.</summary>
    /// <param name="folder">Where to write (the drop folder, or a staging folder to copy from).</param>
    /// <param name="waferId">Wafer id written into the file name and the sidecar.</param>
    /// <param name="diffusionLengthNm">The run's L_eff, nm.</param>
    /// <param name="densityPerCm2">Nucleation density, cm⁻².</param>
    /// <param name="fieldCount">Fields per wafer.</param>
    /// <param name="seed">Seed: the same arguments give the same images.</param>
    /// <param name="model">Growth law; the default when null.</param>
    public static IReadOnlyList<string> Write(string folder, string waferId, double diffusionLengthNm, double densityPerCm2, int fieldCount, int seed, DemoGrowthModel? model = null)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(fieldCount, 1);
        if (!(diffusionLengthNm > 0) || !(densityPerCm2 > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(diffusionLengthNm), "diffusion length and density must be positive");
        }
        model ??= new DemoGrowthModel();
        Directory.CreateDirectory(folder);
        var paths = new List<string>(fieldCount);
        const int Width = 1536;
        const int Height = 1152;
        const int Strip = 48;
        const double PixelNm = 4;
        double widthNm = Width * PixelNm;
        double heightNm = (Height - Strip) * PixelNm;
        for (int f = 0; f < fieldCount; f++)
        {
            int fieldSeed = unchecked((seed * 7919) + f);
            var bounds = CaptureField.Rectangle(widthNm, heightNm);
            Point2D[] sites = NucleationSites.MaternHardCore(bounds, densityPerCm2 * 1e-14 * 1.25, 60, fieldSeed);
            CaptureZoneResult zones = CaptureZones.Compute(sites, bounds, new CaptureZoneOptions { DiffusionLength = diffusionLengthNm });
            var random = new Random(fieldSeed);
            var sides = new double[sites.Length];
            var pixelSites = new (double X, double Y)[sites.Length];
            for (int i = 0; i < sites.Length; i++)
            {
                double r = model.RadiusNm(zones[i].NormalisedArea) + (model.ScatterNm * Gaussian(random));
                r = Math.Max(r, 6);
                // Regular hexagon of the same area as a disc of radius r: (3√3/2)·a² = π·r².
                sides[i] = r / PixelNm * Math.Sqrt(2 * Math.PI / (3 * Math.Sqrt(3)));
                pixelSites[i] = (sites[i].X / PixelNm, sites[i].Y / PixelNm);
            }
            SemField field = SemFieldGenerator.Generate(new SemFieldSpec
            {
                Width = Width,
                Height = Height,
                PixelSizeNm = PixelNm,
                Seed = fieldSeed,
                Sites = pixelSites,
                SideOfSite = i => sides[i],
                InfoStripRows = Strip,
                TiltedFraction = 0.03,
                ParasiticPerThousandSites = 5,
            });
            string path = Path.Combine(folder, $"{waferId}_field{f + 1:00}.png");
            SemFieldWriter.Write(field, path, sidecar: true, waferId: waferId, position: new FieldPosition(-20 + (10 * f), 5 * (f % 2)));
            paths.Add(path);
        }
        return paths;
    }

    private static double Gaussian(Random random)
    {
        double u1 = 1.0 - random.NextDouble();
        double u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
