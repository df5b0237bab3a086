using Microsoft.Extensions.Options;
using RunWatch.Core.Model.Prediction;
using RunWatch.Core.Thermal;

namespace RunWatch.Web.Data.Store;

/// <summary>
/// The planner over the store: the process's accepted model (radius model and Arrhenius D0, Ea, with the convention
/// factor its calibration used; each replaced by RunWatch:Dashboard:Planner when none is accepted, and said so in
/// <see cref="PlannerResult.Model"/>) applied to a planned temperature profile. L_eff = √(c·∫D dt) with ∫D dt
/// integrated exactly over the piecewise-linear profile (<see cref="ThermalIntegrator"/>); radii from simulated
/// Poisson nucleation sites with centroid capture zones clipped at L_eff (<see cref="NucleationFieldSimulator"/>,
/// the wafer pipeline's predictor), guarded wires left out. Without the wafer tables (<paramref name="models"/> null)
/// every prediction uses the configured defaults.
/// </summary>
public sealed class ProcessModelPlanner(IOptions<DashboardOptions> options, StoreWaferData? models = null) : IPlannerEngine
{
    private const double SquareMicrometresPerSquareCentimetre = 1e8;
    private const double MaxCaptureRadiusNm = 20_000;
    private const int Fields = 4;
    private const int TradeOffFields = 2;
    private const int Seed = 1;
    private const double MaxSitesPerField = 40_000;
    private static readonly double[] TradeOffFactors = [0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4];

    public async Task<PlannerResult> PredictAsync(PlannerInput input, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(input);
        double growthS = input.GrowthTime.TotalSeconds;
        double density = input.NucleationDensityPerSquareMicrometre;
        if (input.Profile.Count == 0 || !(growthS > 0) || !(density > 0) || !double.IsFinite(density) || input.Profile.Any(p => !double.IsFinite(p.TemperatureC) || !double.IsFinite(p.Minutes)))
        {
            throw new ArgumentException("Give a temperature profile of finite values, a positive growth time and a positive nucleation density.", nameof(input));
        }
        if (input.Profile.Any(p => p.TemperatureC <= PhysicalConstants.KelvinToCelsius(0) || p.Minutes < 0))
        {
            throw new ArgumentException("Profile temperatures must be above absolute zero and its times not negative.", nameof(input));
        }
        PlannerModel model = models is null
            ? StoreWaferData.DefaultPlannerModel(input.Process, options.Value.Planner)
            : await models.GetPlannerModelAsync(input.Process, options.Value.Planner, cancellationToken).ConfigureAwait(false);
        var diffusivity = new ArrheniusDiffusivity(model.D0CmSquaredPerSecond, model.ActivationEnergyEv);
        var problems = diffusivity.Validate();
        if (problems.Count > 0)
        {
            throw new ArgumentException("The process model cannot be used: " + string.Join(" ", problems), nameof(input));
        }

        var (times, temperatures) = Profile(input.Profile, growthS);
        IntegrationResult integral = ThermalIntegrator.Integrate(times, temperatures, TemperatureCalibration.Identity, diffusivity, 0, growthS, growthS + 1);
        double lNm = DiffusionLength.LengthUm(integral.IntegralCmSq, model.ConventionFactor) * 1000;
        double tEffC = PhysicalConstants.KelvinToCelsius(DiffusionLength.EffectiveTemperatureK(diffusivity, integral.IntegralCmSq, growthS));
        if (!(lNm > 0) || lNm > MaxCaptureRadiusNm)
        {
            throw new ArgumentException($"L_eff comes out at {lNm:0} nm, outside what the planner simulates (up to {MaxCaptureRadiusNm:0} nm); check the profile and the model.", nameof(input));
        }

        List<double> radii = Radii(model, density, lNm, Fields);
        var tradeOff = new List<TradeOffPoint>(TradeOffFactors.Length);
        foreach (double factor in TradeOffFactors)
        {
            List<double> r = Radii(model, density * factor, lNm, TradeOffFields);
            double mean = r.Average();
            double sd = Math.Sqrt(r.Sum(x => (x - mean) * (x - mean)) / Math.Max(1, r.Count - 1));
            tradeOff.Add(new TradeOffPoint(density * factor, mean, sd));
        }
        return new PlannerResult(lNm, tEffC, radii, tradeOff, model);
    }

    /// <summary>Profile in seconds, extended at its last temperature to the end of the growth time.</summary>
    private static (double[] Times, double[] Temperatures) Profile(IReadOnlyList<ProfilePoint> profile, double growthS)
    {
        var ordered = profile.OrderBy(p => p.Minutes).ToList();
        var times = new List<double>(ordered.Count + 2);
        var temperatures = new List<double>(ordered.Count + 2);
        if (ordered[0].Minutes * 60 > 0)
        {
            times.Add(0);
            temperatures.Add(ordered[0].TemperatureC);
        }
        foreach (ProfilePoint p in ordered)
        {
            times.Add(p.Minutes * 60);
            temperatures.Add(p.TemperatureC);
        }
        if (times[^1] < growthS)
        {
            times.Add(growthS);
            temperatures.Add(temperatures[^1]);
        }
        return (times.ToArray(), temperatures.ToArray());
    }

    private static List<double> Radii(PlannerModel model, double densityPerUm2, double lNm, int fields)
    {
        // A field of at least 20 µm and six capture radii a side, so that unguarded wires remain at large L; above
        // 20 µm the side is bounded so that one field holds at most MaxSitesPerField sites and the page stays responsive.
        double sideNm = Math.Max(20_000, 6 * lNm);
        sideNm = Math.Min(sideNm, Math.Max(20_000, Math.Sqrt(MaxSitesPerField / (densityPerUm2 * 1e-6))));
        var simulate = NucleationFieldSimulator.Create(densityPerUm2 * SquareMicrometresPerSquareCentimetre, lNm,
            new NucleationFieldOptions { FieldWidthNm = sideNm, FieldHeightNm = sideNm });
        var areas = new List<double>();
        for (int f = 0; f < fields; f++)
        {
            simulate(Seed + f, areas);
        }
        if (areas.Count < 2)
        {
            throw new ArgumentException($"Too few simulated wires clear of the field edge at {densityPerUm2:0.###} µm⁻² and L_eff {lNm:0} nm; raise the density.");
        }
        var radii = new List<double>(areas.Count);
        foreach (double a in areas)
        {
            radii.Add(model.RadiusForm == RadiusModelForm.Linear ? model.RadiusA + (model.RadiusB * a) : model.RadiusA * Math.Pow(a, model.RadiusB));
        }
        return radii;
    }
}
