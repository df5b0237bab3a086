using RunWatch.Core.Geometry;

namespace RunWatch.Core.PointPatterns;

/// <summary>
/// Capture zones of simulated nucleation sites, for predicting the zone (and hence radius) distribution of a run
/// before its SEM images exist. Sites are drawn in a periodic square box, so no zone is cut by an edge and none is
/// guarded; the box holds about <c>targetSites</c> sites and is at least 4L wide so a zone never meets its own images.
/// </summary>
public static class ZoneSimulation
{
    private const int MaxSites = 2_000_000;

    /// <summary>Simulates one pattern with <paramref name="seed"/> and computes its zones for diffusion length <paramref name="diffusionLength"/>.</summary>
    /// <exception cref="ArgumentException">A bad model, L not &gt; 0, or a box that would need more than 2,000,000 sites.</exception>
    public static SimulatedZones Simulate(SiteModel model, double diffusionLength, int seed, int targetSites = 20_000)
    {
        ArgumentNullException.ThrowIfNull(model);
        model.Validate();
        if (double.IsNaN(diffusionLength) || !(diffusionLength > 0.0))
        {
            throw new ArgumentException($"diffusion length must be > 0 or +∞ (got {diffusionLength})", nameof(diffusionLength));
        }
        ArgumentOutOfRangeException.ThrowIfLessThan(targetSites, 10);

        double side = Math.Sqrt(targetSites / model.Density);
        if (double.IsFinite(diffusionLength))
        {
            side = Math.Max(side, 4.0 * diffusionLength);
        }
        if (model.Density * side * side > MaxSites)
        {
            throw new ArgumentException(
                $"a box 4L = {side:G4} wide holds {model.Density * side * side:G3} sites at this density; more than {MaxSites} (L too large for a simulation)");
        }
        var box = CaptureField.PeriodicBox(side, side);
        (Point2D[] sites, bool reached) = model.Process switch
        {
            SiteProcess.Poisson => (NucleationSites.Poisson(box, model.Density, seed), true),
            SiteProcess.RandomSequentialAdsorption => Rsa(box, model, seed),
            SiteProcess.MaternHardCore => (NucleationSites.MaternHardCore(box, MaternParentDensity(model), model.MinDistance, seed), true),
            _ => throw new ArgumentException($"unknown site process {model.Process}"),
        };
        if (sites.Length == 0)
        {
            throw new ArgumentException("the simulation produced no sites (density × box area too small)");
        }

        CaptureZoneResult zones = CaptureZones.Compute(sites, box, new CaptureZoneOptions { DiffusionLength = diffusionLength });
        double[] areas = zones.Areas.ToArray();
        var normalised = new double[areas.Length];
        double disc = Math.PI * diffusionLength * diffusionLength;
        for (int i = 0; i < areas.Length; i++)
        {
            normalised[i] = double.IsFinite(diffusionLength) ? areas[i] / disc : double.NaN;
        }
        return new SimulatedZones(areas, normalised, sites.Length, sites.Length / box.Area, side, reached);
    }

    /// <summary>
    /// Parent density giving the model's density after Matérn II thinning: inverting λ = (1 − exp(−λp π d²))/(π d²)
    /// gives λp = −ln(1 − λπd²)/(πd²) (DERIVED; needs λπd² &lt; 1).
    /// </summary>
    public static double MaternParentDensity(SiteModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        double disc = Math.PI * model.MinDistance * model.MinDistance;
        return -Math.Log(1.0 - (model.Density * disc)) / disc;
    }

    private static (Point2D[] Sites, bool Reached) Rsa(CaptureField box, SiteModel model, int seed)
    {
        HardCorePattern pattern = NucleationSites.RandomSequentialAdsorption(box, model.Density, model.MinDistance, seed);
        return (pattern.Points, pattern.ReachedTarget);
    }
}
