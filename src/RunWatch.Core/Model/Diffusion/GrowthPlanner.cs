using RunWatch.Core.Geometry;
using RunWatch.Core.PointPatterns;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// The planner's computation: an accepted <see cref="DiffusionRadiusModel"/> applied to a planned run held at one
/// temperature. Nucleation sites are simulated at the planned density (hard-core random sequential adsorption,
/// 100 nm apart) on periodic square fields (no edge, so no wire is guarded); the adatom field is solved at λ(T) with
/// every footprint a sink; each wire gets r² = r₀² + κ·A_i(λ)·t. Footprints: a first pass with 30 nm, then
/// <see cref="GrowthFootprint"/> of each wire's radius from the pass before (two refinements).
/// </summary>
public static class GrowthPlanner
{
    /// <summary>Side of one simulated field (µm): at 20 nm cells 360,000 cells, about a second per solve.</summary>
    public const double FieldUm = 12;

    /// <summary>At least this many wires are simulated (more fields at low density, at most <see cref="MaxFields"/>).</summary>
    public const int MinimumWires = 150;

    /// <summary>Upper bound on the number of fields (keeps the page responsive at very low density).</summary>
    public const int MaxFields = 4;

    /// <summary>Hard-core distance between simulated sites (µm).</summary>
    public const double HardCoreUm = 0.1;

    /// <summary>Grid cell (µm), as the model's capture tables use by default.</summary>
    public const double CellUm = 0.02;

    private const double FirstFootprintUm = 0.03;
    private const int FootprintPasses = 3;

    /// <summary>Predicts the radius distribution of <paramref name="request"/> under <paramref name="model"/>.</summary>
    /// <exception cref="ArgumentException">A non-finite or non-positive input, with a plain message.</exception>
    public static PlannedRadii Plan(DiffusionRadiusModel model, GrowthPlanRequest request)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(request);
        Check(request.TemperatureC, request.GrowthSeconds);
        if (!(request.DensityPerUm2 > 0) || !double.IsFinite(request.DensityPerUm2) || request.DensityPerUm2 > 50)
        {
            throw new ArgumentException($"The nucleation density must lie between 0 and 50 per µm² (got {request.DensityPerUm2}).", nameof(request));
        }
        var box = CaptureField.PeriodicBox(FieldUm, FieldUm);
        int perField = Math.Max(1, (int)Math.Round(request.DensityPerUm2 * FieldUm * FieldUm));
        int fields = Math.Clamp((MinimumWires + perField - 1) / perField, 1, MaxFields);
        var radii = new List<double>();
        var footprints = new List<double>();
        var areas = new List<double>();
        double lambda = double.NaN;
        for (int f = 0; f < fields; f++)
        {
            Point2D[] sites = NucleationSites.RandomSequentialAdsorption(box, request.DensityPerUm2, HardCoreUm, unchecked(request.Seed + (7919 * f))).Points;
            PlannedRadii one = PlanOnSites(model, sites, box, request.TemperatureC, request.GrowthSeconds);
            lambda = one.LambdaUm;
            radii.AddRange(one.RadiiNm);
            footprints.AddRange(one.FootprintsUm);
            areas.AddRange(one.CaptureAreasUm2);
        }
        return Summarise(model, request.TemperatureC, request.GrowthSeconds, lambda, radii.ToArray(), footprints.ToArray(), areas.ToArray(), FieldUm, fields);
    }

    /// <summary>
    /// The same computation on given sites in a periodic <paramref name="box"/> (µm): lets a caller (or a test)
    /// choose the pattern, e.g. a lattice.
    /// </summary>
    /// <exception cref="ArgumentException">A non-periodic box, no sites, or a bad temperature or time.</exception>
    public static PlannedRadii PlanOnSites(DiffusionRadiusModel model, ReadOnlySpan<Point2D> sites, CaptureField box, double temperatureC, double growthSeconds, double cellUm = CellUm)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(box);
        Check(temperatureC, growthSeconds);
        if (!box.Periodic)
        {
            throw new ArgumentException("The planner simulates periodic fields only (no edge, no guarded wire).", nameof(box));
        }
        if (sites.Length == 0)
        {
            throw new ArgumentException("No nucleation site to plan for.", nameof(sites));
        }
        double lambda = model.LambdaAtUm(temperatureC);
        if (!(lambda > 0) || double.IsNaN(lambda))
        {
            throw new ArgumentException($"The model gives no usable capture length at {temperatureC} °C.", nameof(model));
        }
        var footprints = new double[sites.Length];
        Array.Fill(footprints, FirstFootprintUm);
        var radii = new double[sites.Length];
        double[] areas = [];
        for (int pass = 0; pass < FootprintPasses; pass++)
        {
            if (pass > 0)
            {
                for (int i = 0; i < radii.Length; i++)
                {
                    footprints[i] = GrowthFootprint.FootprintUm(radii[i]);
                }
            }
            SinkGrid grid = SinkGrid.Rasterise(sites, footprints, box, cellUm);
            areas = new ScreenedDiffusionSolver(grid).Solve(lambda, BorderCondition.Periodic).CaptureAreas;
            for (int i = 0; i < radii.Length; i++)
            {
                radii[i] = model.RadiusNm(areas[i] * growthSeconds);
            }
        }
        return Summarise(model, temperatureC, growthSeconds, lambda, radii, footprints, areas, box.Width, 1);
    }

    private static PlannedRadii Summarise(DiffusionRadiusModel model, double temperatureC, double growthSeconds, double lambda,
        double[] radii, double[] footprints, double[] areas, double fieldUm, int fields)
    {
        double mean = 0;
        foreach (double r in radii)
        {
            mean += r;
        }
        mean /= radii.Length;
        double ss = 0;
        foreach (double r in radii)
        {
            ss += (r - mean) * (r - mean);
        }
        double sd = radii.Length > 1 ? Math.Sqrt(ss / (radii.Length - 1)) : 0;
        bool temperatureOutside = !model.Covers(temperatureC, Middle(model.CalibratedMinS, model.CalibratedMaxS));
        bool timeOutside = !model.Covers(Middle(model.CalibratedMinC, model.CalibratedMaxC), growthSeconds);
        return new PlannedRadii(lambda, radii, footprints, areas, mean, sd, temperatureOutside, timeOutside, fieldUm, fields);
    }

    /// <summary>A value inside a calibrated range, so that <see cref="DiffusionRadiusModel.Covers"/> judges the other quantity alone.</summary>
    private static double Middle(double min, double max) => double.IsFinite(min) && double.IsFinite(max) ? 0.5 * (min + max) : double.NaN;

    private static void Check(double temperatureC, double growthSeconds)
    {
        if (!double.IsFinite(temperatureC) || temperatureC <= -273.15)
        {
            throw new ArgumentException($"The growth temperature must be a finite value above absolute zero (got {temperatureC} °C).", nameof(temperatureC));
        }
        if (!(growthSeconds > 0) || !double.IsFinite(growthSeconds))
        {
            throw new ArgumentException($"The growth time must be a positive number of seconds (got {growthSeconds}).", nameof(growthSeconds));
        }
    }
}
