using RunWatch.Core.Model;
using RunWatch.Core.Wafers;
using RunWatch.Storage;

namespace RunWatch.Wafers.Pipeline;

/// <summary>
/// Proposes a process's models from its stored wafers: the diffusion radius model (λ₀², E_λ, κ, r₀ fitted jointly to
/// the per-wire radii over each wafer's real thermal history, with profile-likelihood intervals, or a refusal with its
/// reason), and the simpler options kept for comparison: the Arrhenius calibration from the wafers' best-fit capture
/// radii and the Â regression. Results are stored as proposals; a person accepts them before anything uses them.
/// </summary>
public sealed partial class ProcessCalibrationService(IWaferStore wafers, TimeProvider time, IRunWatchStore? store = null,
    Microsoft.Extensions.Options.IOptions<WaferPipelineOptions>? options = null)
{
    private const int MaxWafers = 10_000;

    /// <summary>Fits and stores a proposal; null when fewer than two wafers at distinct temperatures exist.</summary>
    public async Task<(ArrheniusFit Fit, ModelFitRecord Record)?> ProposeAsync(string process, CancellationToken cancellationToken)
    {
        var latestPerWafer = new Dictionary<string, ArrheniusPoint>(StringComparer.Ordinal);
        foreach (ModelFitRecord record in await wafers.GetModelFitsAsync(process, ModelKinds.CaptureRadius, 1000, cancellationToken).ConfigureAwait(false))
        {
            var point = ModelJson.Deserialize<ArrheniusPoint>(record.ParamsJson);
            latestPerWafer.TryAdd(point.WaferId, point); // newest first: the first seen per wafer is its latest
        }
        var points = latestPerWafer.Values.OrderBy(p => p.WaferId, StringComparer.Ordinal).ToList();
        if (points.Count < 2 || points.Select(p => Math.Round(p.EffectiveTemperatureK, 1)).Distinct().Count() < 2)
        {
            return null;
        }
        ArrheniusFit fit = ArrheniusCalibration.Fit(points);
        ModelFitRecord saved = await wafers.SaveModelFitAsync(new ModelFitRecord
        {
            Process = process,
            Model = ModelKinds.Arrhenius,
            FittedAt = time.GetUtcNow(),
            ParamsJson = ModelJson.Serialize(fit),
            RSquared = fit.RSquared,
            Wafers = fit.WaferIds,
        }, cancellationToken).ConfigureAwait(false);
        return (fit, saved);
    }

    /// <summary>
    /// Fits the radius model (both forms, selected by AIC, <see cref="RadiusModelFitter.FitAndSelect"/>) to the wires of
    /// every wafer of the process pooled (latest analysis of each analysed field; vertical wires clear of the edge and
    /// band, with their normalised capture area at the run's L_eff, the same wires and Â the wafer evaluation judges)
    /// and stores it as a proposal; null when fewer than three such wires exist.
    /// </summary>
    public async Task<(RadiusModelFit Fit, ModelFitRecord Record)?> ProposeRadiusModelAsync(string process, CancellationToken cancellationToken)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(process);
        var areas = new List<double>();
        var radii = new List<double>();
        var used = new List<string>();
        foreach (WaferRecord wafer in await wafers.ListWafersAsync(MaxWafers, cancellationToken).ConfigureAwait(false))
        {
            if (wafer.Process != process)
            {
                continue;
            }
            int before = areas.Count;
            foreach (FieldRecord field in await wafers.GetFieldsOfWaferAsync(wafer.Name, cancellationToken).ConfigureAwait(false))
            {
                if (field.Status != FieldStatus.Analysed)
                {
                    continue;
                }
                AnalysisRecord? analysis = await wafers.GetLatestAnalysisAsync(field.Id, cancellationToken).ConfigureAwait(false);
                if (analysis?.ResultsJson is null)
                {
                    continue;
                }
                FieldResult result = FieldResultJson.Read(analysis.ResultsJson);
                foreach (FieldWire w in result.Wires)
                {
                    if (WaferEvaluator.Counts(w) && w.ZoneNormalised is { } a && a > 0 && double.IsFinite(a) && double.IsFinite(w.RadiusNm))
                    {
                        areas.Add(a);
                        radii.Add(w.RadiusNm);
                    }
                }
            }
            if (areas.Count > before)
            {
                used.Add(wafer.Name);
            }
        }
        if (areas.Count < 3)
        {
            return null;
        }
        RadiusModelFit fit = RadiusModelFitter.FitAndSelect(areas.ToArray(), radii.ToArray()).SelectedFit;
        used.Sort(StringComparer.Ordinal);
        ModelFitRecord saved = await wafers.SaveModelFitAsync(new ModelFitRecord
        {
            Process = process,
            Model = ModelKinds.Radius,
            FittedAt = time.GetUtcNow(),
            ParamsJson = ModelJson.Serialize(fit),
            RSquared = fit.RSquared,
            RmseNm = fit.RmseNm,
            Wafers = used,
        }, cancellationToken).ConfigureAwait(false);
        return (fit, saved);
    }

    /// <summary>Proposes both the radius model and the Arrhenius calibration from the process's stored wafers.</summary>
    /// <exception cref="InvalidOperationException">Neither could be fitted; the message says what is missing.</exception>
    public async Task<ProcessRefit> RefitAsync(string process, CancellationToken cancellationToken)
    {
        DiffusionRefit diffusion = await ProposeDiffusionModelAsync(process, cancellationToken).ConfigureAwait(false);
        var radius = await ProposeRadiusModelAsync(process, cancellationToken).ConfigureAwait(false);
        var arrhenius = await ProposeAsync(process, cancellationToken).ConfigureAwait(false);
        if (!diffusion.Proposed && radius is null && arrhenius is null)
        {
            throw new InvalidOperationException($"Nothing to refit for process {process}: the diffusion model was not fitted ({diffusion.Reason}); " +
                "the Â regression needs at least three measured wires, and the Arrhenius fit wafers with a located capture radius at two or more temperatures.");
        }
        return new ProcessRefit(process, radius?.Fit, radius?.Record, arrhenius?.Fit, arrhenius?.Record, diffusion);
    }
}
