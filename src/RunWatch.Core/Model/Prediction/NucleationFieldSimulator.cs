using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;

namespace RunWatch.Core.Model.Prediction;

/// <summary>
/// The standard <see cref="FieldSimulator"/>: seeded nucleation sites (the geometry room's Poisson or hard-core
/// generator) in a rectangular field, centroid-based capture zones at L, and Â of the unguarded wires.
/// </summary>
public static class NucleationFieldSimulator
{
    private const double SquareNanometresPerSquareCentimetre = 1e14;

    /// <summary>A simulator for the given density (cm⁻²) and capture radius (nm).</summary>
    /// <exception cref="ArgumentException">Non-positive density or L, or invalid options.</exception>
    public static FieldSimulator Create(double densityPerCm2, double captureRadiusNm, NucleationFieldOptions? options = null)
    {
        options ??= new NucleationFieldOptions();
        options.Validate();
        if (!(densityPerCm2 > 0) || !(captureRadiusNm > 0) || !double.IsFinite(captureRadiusNm))
        {
            throw new ArgumentException($"Density and L must be positive; got {densityPerCm2} cm⁻², {captureRadiusNm} nm.");
        }
        double densityPerNm2 = densityPerCm2 / SquareNanometresPerSquareCentimetre;
        var field = CaptureField.Rectangle(options.FieldWidthNm, options.FieldHeightNm);
        // One thread per field: the predictor's fields are many and small, and the machine is shared.
        var zoneOptions = new CaptureZoneOptions { DiffusionLength = captureRadiusNm, GuardRule = options.GuardRule, MaxDegreeOfParallelism = 1 };
        NucleationSiteProcess process = options.Process;
        double hardCore = options.HardCoreDistanceNm;

        return (seed, areas) =>
        {
            Point2D[] sites = process == NucleationSiteProcess.Poisson
                ? NucleationSites.Poisson(field, densityPerNm2, seed)
                : NucleationSites.RandomSequentialAdsorption(field, densityPerNm2, hardCore, seed).Points;
            if (sites.Length == 0)
            {
                return;
            }
            CaptureZoneResult zones = CaptureZones.Compute(sites, field, zoneOptions);
            areas.AddRange(zones.UnguardedNormalisedAreas());
        };
    }

    /// <summary>Predicts with simulated nucleation at the request's density and L_eff.</summary>
    public static RadiusPrediction Predict(RadiusPredictionRequest request, NucleationFieldOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(request);
        return RadiusPredictor.Predict(request, Create(request.DensityPerCm2, request.CaptureRadiusNm, options));
    }
}
