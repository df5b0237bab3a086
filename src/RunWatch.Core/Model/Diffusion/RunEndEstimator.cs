using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// The run-end expectation from an accepted <see cref="DiffusionRadiusModel"/>: wire sites are simulated at the
/// process's recent density (hard-core random sequential adsorption, 100 nm apart) on a periodic square (no edge,
/// so no wire is guarded), the diffusion field is solved over the run's λ range, and the model is applied over the
/// real record. Footprints: a first pass with 30 nm, then 0.75 × each wire's predicted radius
/// (<see cref="GrowthFootprint"/>). Seeded: the same inputs give the same estimate.
/// </summary>
public static class RunEndEstimator
{
    /// <summary>Estimates the run. <paramref name="excursions"/> are spans on the record's axis; each is judged against <paramref name="setpointC"/>.</summary>
    public static RunEndEstimate Estimate(DiffusionRadiusModel model, ThermalRecord record, TemperatureCalibration calibration, GrowthWindow window,
        double setpointC, IReadOnlyList<GrowthWindow> excursions, double densityPerUm2, int seed, double fieldUm = 12, CaptureTableOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(record);
        ArgumentNullException.ThrowIfNull(excursions);
        if (!(densityPerUm2 > 0) || !double.IsFinite(densityPerUm2))
        {
            throw new ArgumentException($"The wire density must be a positive number (got {densityPerUm2} per µm²).", nameof(densityPerUm2));
        }
        ThermalExposure exposure = ThermalExposure.FromRecord(record, calibration, window);
        (double lo, double hi) = exposure.LambdaRange(model.Law);
        double setpointK = PhysicalConstants.CelsiusToKelvin(setpointC);
        double lambdaSet = model.Law.LambdaUm(setpointK);
        lo = Math.Min(lo, lambdaSet);
        hi = Math.Max(hi, lambdaSet);
        var box = CaptureField.PeriodicBox(fieldUm, fieldUm);
        Point2D[] sites = NucleationSites.RandomSequentialAdsorption(box, densityPerUm2, 0.1, seed).Points;
        double[] footprints = Enumerable.Repeat(0.03, sites.Length).ToArray();
        CaptureAreaTable table = CaptureAreaTable.Build(sites, footprints, box, lo / 1.05, hi * 1.05, options);
        FieldPrediction first = FieldPrediction.Compute(model, table, exposure);
        for (int i = 0; i < footprints.Length; i++)
        {
            footprints[i] = GrowthFootprint.FootprintUm(first.PredictedRadiiNm[i]);
        }
        table = CaptureAreaTable.Build(sites, footprints, box, lo / 1.05, hi * 1.05, options);
        FieldPrediction p = FieldPrediction.Compute(model, table, exposure);
        double mean = p.MeanUnguardedNm, ss = 0;
        foreach (double r in p.PredictedRadiiNm)
        {
            ss += (r - mean) * (r - mean);
        }
        IReadOnlyList<ExcursionRadiusEffect> effects = ExcursionRadiusEffect.Compute(model, table, record, calibration, window, setpointC, excursions);
        return new RunEndEstimate(lambdaSet, p.LambdaEffUm, mean, Math.Sqrt(ss / Math.Max(sites.Length - 1, 1)), sites.Length, effects,
            !model.Covers(PhysicalConstants.KelvinToCelsius(exposure.MeanTemperatureK), exposure.CoveredS));
    }
}
