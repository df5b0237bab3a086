using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Imaging.Scale;
using RunWatch.Simulation.Growth;
using RunWatch.Simulation.Sem;

namespace RunWatch.Simulation.Demo;

/// <summary>
/// Makes the SEM fields of a demo wafer (invented data), drawn as a top-down SEM image by
/// <see cref="MicroscopeFieldGenerator"/> (edge rims, shot noise, drift, a drawn information strip) with a sidecar
/// naming the wafer and the pixel size. <see cref="WriteGrown"/> is the demo's: each field is a window of a larger
/// periodic substrate whose wires were grown by the adatom simulation (<see cref="GrowthSimulation"/>) over the run's
/// real thermal history. <see cref="Write"/> draws quick fields for pipeline tests whose radii come from a simple
/// stand-in law (<see cref="DemoGrowthModel"/> on capture zones); it is not a growth truth.
/// </summary>
public static class DemoWaferFields
{
    /// <summary>Image width (pixels).</summary>
    public const int Width = 1536;

    /// <summary>Image height including the information strip (pixels).</summary>
    public const int Height = 1152;

    /// <summary>Rows of the information strip.</summary>
    public const int Strip = 48;

    /// <summary>Pixel size (nm).</summary>
    public const double PixelNm = 4;

    /// <summary>Substrate simulated around each image on every side (µm), so that edge wires have their real neighbours.</summary>
    public const double MarginUm = 0.75;

    /// <summary>Width of the imaged window (µm).</summary>
    public static double ImageWidthUm => Width * PixelNm / 1000;

    /// <summary>Height of the imaged window, strip excluded (µm).</summary>
    public static double ImageHeightUm => (Height - Strip) * PixelNm / 1000;

    /// <summary>
    /// Grows and writes <paramref name="fieldCount"/> fields of wafer <paramref name="waferId"/>: hard-core nucleation
    /// sites at <paramref name="densityPerUm2"/> on a periodic substrate <see cref="MarginUm"/> larger than the image on
    /// every side, wires grown by the adatom simulation over <paramref name="history"/>, the image window drawn.
    /// </summary>
    /// <param name="folder">Where to write.</param>
    /// <param name="waferId">Wafer id written into the file name and the sidecar.</param>
    /// <param name="history">The run's growth history (true substrate temperature over the growth window).</param>
    /// <param name="physics">The invented adatom physics.</param>
    /// <param name="densityPerUm2">Nucleation density (per µm²).</param>
    /// <param name="fieldCount">Fields per wafer.</param>
    /// <param name="launchedPerWire">Adatoms launched per wire (the catch's noise is about 1/√(0.6 × this)).</param>
    /// <param name="seed">Seed: the same arguments give the same images.</param>
    /// <returns>The written image paths and each field's grown wires (all of the substrate, in µm of the substrate).</returns>
    public static (IReadOnlyList<string> Paths, IReadOnlyList<GrownWires> Truth) WriteGrown(string folder, string waferId, CaptureHistory history, AdatomPhysics physics,
        double densityPerUm2, int fieldCount, int launchedPerWire, int seed)
    {
        ArgumentNullException.ThrowIfNull(history);
        ArgumentNullException.ThrowIfNull(physics);
        ArgumentOutOfRangeException.ThrowIfLessThan(fieldCount, 1);
        if (!(densityPerUm2 > 0) || !double.IsFinite(densityPerUm2))
        {
            throw new ArgumentOutOfRangeException(nameof(densityPerUm2), "the density must be a positive number per µm²");
        }
        Directory.CreateDirectory(folder);
        double boxW = ImageWidthUm + (2 * MarginUm), boxH = ImageHeightUm + (2 * MarginUm);
        var paths = new List<string>(fieldCount);
        var truth = new List<GrownWires>(fieldCount);
        for (int f = 0; f < fieldCount; f++)
        {
            int fieldSeed = unchecked((seed * 7919) + f);
            Point2D[] sites = NucleationSites.RandomSequentialAdsorption(CaptureField.PeriodicBox(boxW, boxH), densityPerUm2, 0.2, fieldSeed).Points;
            GrownWires grown = GrowthSimulation.Grow(sites, boxW, boxH, history, physics, launchedPerWire, unchecked(fieldSeed + 17));
            truth.Add(grown);
            var pixelSites = new List<(double X, double Y)>(sites.Length);
            var radii = new List<double>(sites.Length);
            for (int i = 0; i < sites.Length; i++)
            {
                double x = (sites[i].X - MarginUm) * 1000 / PixelNm, y = (sites[i].Y - MarginUm) * 1000 / PixelNm;
                if (x >= 0 && x < Width && y >= 0 && y < Height - Strip)
                {
                    pixelSites.Add((x, y));
                    radii.Add(grown.RadiiNm[i]);
                }
            }
            paths.Add(DrawField(folder, waferId, f, pixelSites, radii, fieldSeed));
        }
        return (paths, truth);
    }

    /// <summary>Writes <paramref name="fieldCount"/> quick fields of wafer <paramref name="waferId"/> for pipeline tests (stand-in radii, not a growth truth); returns their paths.</summary>
    /// <param name="folder">Where to write (the drop folder, or a staging folder to copy from).</param>
    /// <param name="waferId">Wafer id written into the file name and the sidecar.</param>
    /// <param name="diffusionLengthNm">Capture-zone clip radius of the stand-in law, nm.</param>
    /// <param name="densityPerCm2">Nucleation density, cm⁻².</param>
    /// <param name="fieldCount">Fields per wafer.</param>
    /// <param name="seed">Seed: the same arguments give the same images.</param>
    /// <param name="model">Stand-in law; the default when null.</param>
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
        double widthNm = Width * PixelNm;
        double heightNm = (Height - Strip) * PixelNm;
        for (int f = 0; f < fieldCount; f++)
        {
            int fieldSeed = unchecked((seed * 7919) + f);
            var bounds = CaptureField.Rectangle(widthNm, heightNm);
            Point2D[] sites = NucleationSites.MaternHardCore(bounds, densityPerCm2 * 1e-14 * 1.25, 60, fieldSeed);
            CaptureZoneResult zones = CaptureZones.Compute(sites, bounds, new CaptureZoneOptions { DiffusionLength = diffusionLengthNm });
            var random = new Random(fieldSeed);
            var pixelSites = new List<(double X, double Y)>(sites.Length);
            var radii = new List<double>(sites.Length);
            for (int i = 0; i < sites.Length; i++)
            {
                radii.Add(Math.Max(model.RadiusNm(zones[i].NormalisedArea) + (model.ScatterNm * Gaussian(random)), 6));
                pixelSites.Add((sites[i].X / PixelNm, sites[i].Y / PixelNm));
            }
            paths.Add(DrawField(folder, waferId, f, pixelSites, radii, fieldSeed));
        }
        return paths;
    }

    /// <summary>Draws one field as the microscope makes it: edge rims, shot noise, jitter, drift, texture, a few tilted wires and crystallites.</summary>
    private static string DrawField(string folder, string waferId, int index, List<(double X, double Y)> pixelSites, List<double> radiiNm, int fieldSeed)
    {
        var random = new Random(unchecked(fieldSeed + 1));
        int n = pixelSites.Count;
        var sides = new double[n];
        double meanRadius = 0;
        for (int i = 0; i < n; i++)
        {
            // Regular hexagon of the same area as a disc of radius r: (3√3/2)·a² = π·r².
            sides[i] = radiiNm[i] / PixelNm * Math.Sqrt(2 * Math.PI / (3 * Math.Sqrt(3)));
            meanRadius += sides[i] * 0.909 / Math.Max(n, 1);
        }
        var objects = new List<MicroscopeObject>(n + 16);
        int crystallites = Math.Max(1, n / 200);
        for (int c = 0; c < crystallites; c++)
        {
            objects.Add(MicroscopeScene.RandomCrystallite(random, meanRadius) with { X = random.NextDouble() * Width, Y = random.NextDouble() * (Height - Strip) });
        }
        for (int i = 0; i < n; i++)
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
        string path = Path.Combine(folder, $"{waferId}_field{index + 1:00}.png");
        MicroscopeFieldWriter.Write(field, path, waferId: waferId, position: new FieldPosition(-20 + (10 * index), 5 * (index % 2)));
        return path;
    }

    private static double Gaussian(Random random)
    {
        double u1 = 1.0 - random.NextDouble();
        double u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
