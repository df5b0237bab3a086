using System.Globalization;
using RunWatch.Core.Model;
using RunWatch.Core.Thermal;
using RunWatch.Core.Wafers;
using RunWatch.Storage;
using CoreArrheniusFit = RunWatch.Core.Model.ArrheniusFit;
using CoreArrheniusPoint = RunWatch.Core.Model.ArrheniusPoint;

namespace RunWatch.Web.Data.Store;

/// <summary>Process models: the Process model screen's view, acceptance, and the model the planner uses.</summary>
public sealed partial class StoreWaferData
{
    private const int MaxRadiusPoints = 5000;

    public async Task<ProcessModelView?> GetProcessModelAsync(string process, CancellationToken cancellationToken)
    {
        var radius = await wafers.GetModelFitsAsync(process, ModelKinds.Radius, 50, cancellationToken).ConfigureAwait(false);
        var arrheniusFits = await wafers.GetModelFitsAsync(process, ModelKinds.Arrhenius, 50, cancellationToken).ConfigureAwait(false);
        DiffusionModelView? diffusion = await DiffusionModelAsync(process, cancellationToken).ConfigureAwait(false);
        if (radius.Count == 0 && arrheniusFits.Count == 0 && diffusion is null)
        {
            return null;
        }
        var (accepted, candidate) = AcceptedAndProposed(radius);
        var (acceptedArrhenius, candidateArrhenius) = AcceptedAndProposed(arrheniusFits);
        ModelFitRecord? shown = accepted ?? candidate;
        RadiusFit current = shown is null ? new RadiusFit(RadiusModelForm.Linear, double.NaN, double.NaN, double.NaN, double.NaN, 0, DateTimeOffset.MinValue) : ToRadiusFit(shown);
        ArrheniusFit arrhenius = (acceptedArrhenius ?? candidateArrhenius) is { } a ? ToArrhenius(a) : new ArrheniusFit(double.NaN, double.NaN, double.NaN);
        var points = new List<ArrheniusPoint>();
        foreach (ModelFitRecord r in await wafers.GetModelFitsAsync(process, ModelKinds.CaptureRadius, 500, cancellationToken).ConfigureAwait(false))
        {
            CoreArrheniusPoint point = ModelJson.Deserialize<CoreArrheniusPoint>(r.ParamsJson);
            if (point.CaptureRadiusNm > 0 && point.GrowthDurationS > 0 && point.ConventionFactor > 0)
            {
                points.Add(new ArrheniusPoint(point.EffectiveTemperatureK, ArrheniusCalibration.DiffusivityCmSqPerS(point)));
            }
        }
        IReadOnlyList<ModelPoint> wires = await RadiusDataAsync(process, cancellationToken).ConfigureAwait(false);
        // With nothing accepted yet the newest proposal is shown as the model and offered for acceptance.
        return new ProcessModelView(process, current, candidate is null ? null : ToRadiusFit(candidate), arrhenius, wires, points,
            accepted?.AcceptedBy, accepted?.AcceptedAt, acceptedArrhenius is not null && candidateArrhenius is not null ? ToArrhenius(candidateArrhenius) : null, diffusion);
    }

    /// <summary>
    /// Accepts, in the name of <paramref name="user"/>, the newest proposed diffusion model, radius model and Arrhenius
    /// calibration of the process (each when newer than the one accepted); returns what was accepted.
    /// </summary>
    /// <exception cref="InvalidOperationException">Nothing is proposed.</exception>
    public async Task<string> AcceptModelAsync(string process, string user, CancellationToken cancellationToken)
    {
        var accepted = new List<string>();
        foreach (string model in new[] { ModelKinds.Diffusion, ModelKinds.Radius, ModelKinds.Arrhenius })
        {
            var fits = await wafers.GetModelFitsAsync(process, model, 50, cancellationToken).ConfigureAwait(false);
            if (AcceptedAndProposed(fits).Proposed is { } proposed)
            {
                await wafers.AcceptModelFitAsync(proposed.Id, user, cancellationToken).ConfigureAwait(false);
                accepted.Add(model switch
                {
                    ModelKinds.Diffusion => "diffusion model " + DescribeDiffusion(proposed),
                    ModelKinds.Radius => "radius model " + Describe(ToRadiusFit(proposed)),
                    _ => "Arrhenius fit " + Describe(ToArrhenius(proposed)),
                });
            }
        }
        if (accepted.Count == 0)
        {
            throw new InvalidOperationException($"Process {process} has no proposed model to accept; refit first.");
        }
        return "accepted " + string.Join("; ", accepted);
    }

    /// <summary>
    /// The model the planner uses for <paramref name="process"/>: its accepted radius model and accepted Arrhenius
    /// calibration, each replaced by the configured default (<paramref name="defaults"/>) when none is accepted.
    /// The convention factor c is the one of the capture radii the accepted calibration was fitted on.
    /// </summary>
    public async Task<PlannerModel> GetPlannerModelAsync(string process, PlannerOptions defaults, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        ModelFitRecord? radius = process.Length == 0 ? null
            : AcceptedAndProposed(await wafers.GetModelFitsAsync(process, ModelKinds.Radius, 50, cancellationToken).ConfigureAwait(false)).Accepted;
        ModelFitRecord? arrhenius = process.Length == 0 ? null
            : AcceptedAndProposed(await wafers.GetModelFitsAsync(process, ModelKinds.Arrhenius, 50, cancellationToken).ConfigureAwait(false)).Accepted;
        RadiusModelForm form = RadiusModelForm.Linear;
        double a = defaults.RadiusInterceptNm;
        double b = defaults.RadiusSlopeNm;
        if (radius is not null)
        {
            RadiusModelFit fit = ModelJson.Deserialize<RadiusModelFit>(radius.ParamsJson);
            (form, a, b) = (fit.Kind == RadiusModelKind.PowerLaw ? RadiusModelForm.PowerLaw : RadiusModelForm.Linear, fit.Parameters[0].Value, fit.Parameters[1].Value);
        }
        double d0 = defaults.D0CmSquaredPerSecond;
        double ea = defaults.ActivationEnergyEv;
        double c = defaults.ConventionFactor;
        if (arrhenius is not null)
        {
            CoreArrheniusFit fit = ModelJson.Deserialize<CoreArrheniusFit>(arrhenius.ParamsJson);
            ArrheniusDiffusivity accepted = fit.ToDiffusivity();
            (d0, ea) = (accepted.D0CmSqPerS, accepted.EaEv);
            c = await ConventionFactorAsync(process, fit.WaferIds, cancellationToken).ConfigureAwait(false) ?? c;
        }
        return new PlannerModel(process, form, a, b, radius?.AcceptedBy, radius?.AcceptedAt, d0, ea, c, arrhenius?.AcceptedBy, arrhenius?.AcceptedAt);
    }

    /// <summary>The configured defaults only, for a process without accepted models or a host without wafer tables.</summary>
    public static PlannerModel DefaultPlannerModel(string process, PlannerOptions defaults)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        return new PlannerModel(process, RadiusModelForm.Linear, defaults.RadiusInterceptNm, defaults.RadiusSlopeNm, null, null,
            defaults.D0CmSquaredPerSecond, defaults.ActivationEnergyEv, defaults.ConventionFactor, null, null);
    }

    private async Task<double?> ConventionFactorAsync(string process, IReadOnlyList<string> waferIds, CancellationToken cancellationToken)
    {
        var wanted = new HashSet<string>(waferIds, StringComparer.Ordinal);
        var counts = new Dictionary<double, int>();
        foreach (ModelFitRecord r in await wafers.GetModelFitsAsync(process, ModelKinds.CaptureRadius, 1000, cancellationToken).ConfigureAwait(false))
        {
            CoreArrheniusPoint point = ModelJson.Deserialize<CoreArrheniusPoint>(r.ParamsJson);
            if (wanted.Remove(point.WaferId) && point.ConventionFactor > 0)
            {
                counts[point.ConventionFactor] = counts.GetValueOrDefault(point.ConventionFactor) + 1;
            }
        }
        // The daemon uses one convention per deployment; should points disagree, the most common one is used.
        return counts.Count == 0 ? null : counts.MaxBy(kv => kv.Value).Key;
    }

    /// <summary>
    /// The wires a refit pools (vertical, clear of edge and band, with a normalised capture area), from the latest
    /// analysis of each analysed field of the process's wafers, at most <see cref="MaxRadiusPoints"/> for the chart.
    /// </summary>
    private async Task<IReadOnlyList<ModelPoint>> RadiusDataAsync(string process, CancellationToken cancellationToken)
    {
        var points = new List<ModelPoint>();
        foreach (WaferRecord wafer in await wafers.ListWafersAsync(1000, cancellationToken).ConfigureAwait(false))
        {
            if (wafer.Process != process)
            {
                continue;
            }
            foreach (FieldRecord field in await wafers.GetFieldsOfWaferAsync(wafer.Name, cancellationToken).ConfigureAwait(false))
            {
                AnalysisRecord? analysis = field.Status == FieldStatus.Analysed
                    ? await wafers.GetLatestAnalysisAsync(field.Id, cancellationToken).ConfigureAwait(false)
                    : null;
                if (analysis?.ResultsJson is not { } json)
                {
                    continue;
                }
                foreach (FieldWire w in FieldResultJson.Read(json).Wires)
                {
                    double a = w.ZoneNormalised ?? double.NaN;
                    if (points.Count < MaxRadiusPoints && WaferEvaluator.Counts(w) && a > 0 && double.IsFinite(w.RadiusNm))
                    {
                        points.Add(new ModelPoint(a, w.RadiusNm, wafer.Name));
                    }
                }
            }
        }
        return points;
    }


    /// <summary>The newest accepted fit and the newest proposal made after it (fits are newest first).</summary>
    private static (ModelFitRecord? Accepted, ModelFitRecord? Proposed) AcceptedAndProposed(IReadOnlyList<ModelFitRecord> fits)
    {
        ModelFitRecord? accepted = fits.FirstOrDefault(f => f.AcceptedAt is not null);
        ModelFitRecord? proposed = fits.FirstOrDefault(f => f.AcceptedAt is null && (accepted is null || f.Id > accepted.Id));
        return (accepted, proposed);
    }

    private static string Describe(RadiusFit f) => f.Form == RadiusModelForm.Linear
        ? string.Create(CultureInfo.InvariantCulture, $"r = {f.A:0.###} + {f.B:0.###}·Â nm")
        : string.Create(CultureInfo.InvariantCulture, $"r = {f.A:0.###}·Â^{f.B:0.####} nm");

    private static string Describe(ArrheniusFit f) =>
        string.Create(CultureInfo.InvariantCulture, $"Ea {f.ActivationEnergyEv:0.###} eV, D0 {f.D0CmSquaredPerSecond:0.###e+0} cm²/s");

    private static RadiusFit ToRadiusFit(ModelFitRecord r)
    {
        RadiusModelFit fit = ModelJson.Deserialize<RadiusModelFit>(r.ParamsJson);
        var form = fit.Kind == RadiusModelKind.PowerLaw ? RadiusModelForm.PowerLaw : RadiusModelForm.Linear;
        return new RadiusFit(form, fit.Parameters[0].Value, fit.Parameters[1].Value, r.RSquared ?? double.NaN, r.RmseNm ?? double.NaN, fit.Count, r.FittedAt);
    }

    private static ArrheniusFit ToArrhenius(ModelFitRecord r)
    {
        CoreArrheniusFit fit = ModelJson.Deserialize<CoreArrheniusFit>(r.ParamsJson);
        return new ArrheniusFit(fit.Prefactor.Value, fit.ActivationEnergy.Value, r.RSquared ?? double.NaN);
    }
}
