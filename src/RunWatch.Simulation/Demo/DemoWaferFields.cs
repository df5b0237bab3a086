using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Imaging.Scale;
using RunWatch.Simulation.Sem;

namespace RunWatch.Simulation.Demo;

/// <summary>
/// Makes the SEM fields of a demo wafer (invented data): random nucleation sites, each wire's capture zone at the
/// run's effective diffusion length, its radius from <see cref="DemoGrowthModel"/>, drawn as a top-down SEM image by
/// <see cref="MicroscopeFieldGenerator"/> (edge rims, shot noise, drift, a drawn information strip) with a sidecar
/// naming the wafer and the pixel size.
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
            // Drawn as the microscope makes it: edge rims, shot noise, jitter, drift, texture, a few tilted wires and crystallites.
            var objects = new List<MicroscopeObject>(sites.Length + 16);
            double meanRadius = 0;
            for (int i = 0; i < sites.Length; i++)
            {
                meanRadius += sides[i] * 0.909 / sites.Length;
            }
            int crystallites = Math.Max(1, sites.Length / 200);
            for (int c = 0; c < crystallites; c++)
            {
                objects.Add(MicroscopeScene.RandomCrystallite(random, meanRadius) with { X = random.NextDouble() * Width, Y = random.NextDouble() * (Height - Strip) });
            }
            for (int i = 0; i < sites.Length; i++)
            {
                objects.Add(random.NextDouble() < 0.03
                    ? new MicroscopeObject { Kind = SemObjectKind.Tilted, X = pixelSites[i].X, Y = pixelSites[i].Y, Size = 0.8 * sides[i], Length = sides[i] * (3 + (3 * random.NextDouble())), AngleDeg = random.NextDouble() * 360 }
                    : new MicroscopeObject { Kind = SemObjectKind.Vertical, X = pixelSites[i].X, Y = pixelSites[i].Y, Size = sides[i], AngleDeg = random.NextDouble() * 60 });
            }
            MicroscopeField field = MicroscopeFieldGenerator.Generate(new MicroscopeFieldSpec
            {
                Width = Width,
                Height = Height,
                PixelSizeNm = PixelNm,
                Seed = fieldSeed,
                Objects = objects,
                StripRows = Strip,
                ScaleBarNm = 1000,
            });
            string path = Path.Combine(folder, $"{waferId}_field{f + 1:00}.png");
            MicroscopeFieldWriter.Write(field, path, waferId: waferId, position: new FieldPosition(-20 + (10 * f), 5 * (f % 2)));
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
