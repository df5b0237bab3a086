using RunWatch.Core.Model;
using RunWatch.Storage;

namespace RunWatch.Ingest.Wafers;

/// <summary>
/// Proposes a process's Arrhenius calibration from its wafers' best-fit capture radii: ln(L²/(c·t)) against 1/T_eff
/// gives Ea and D0. The result is stored as a proposal; a person accepts it before anything uses it.
/// </summary>
public sealed class ProcessCalibrationService(IWaferStore wafers, TimeProvider time)
{
    /// <summary>Fits and stores a proposal; null when fewer than two wafers at distinct temperatures exist.</summary>
    public async Task<(ArrheniusFit Fit, ModelFitRecord Record)?> ProposeAsync(string process, CancellationToken cancellationToken)
    {
        var latestPerWafer = new Dictionary<string, ArrheniusPoint>(StringComparer.Ordinal);
        foreach (ModelFitRecord record in await wafers.GetModelFitsAsync(process, WaferReportService.CaptureRadiusModelName, 1000, cancellationToken).ConfigureAwait(false))
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
            Model = WaferReportService.ArrheniusModelName,
            FittedAt = time.GetUtcNow(),
            ParamsJson = ModelJson.Serialize(fit),
            RSquared = fit.RSquared,
            Wafers = fit.WaferIds,
        }, cancellationToken).ConfigureAwait(false);
        return (fit, saved);
    }
}
