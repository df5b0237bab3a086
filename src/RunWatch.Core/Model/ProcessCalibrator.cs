namespace RunWatch.Core.Model;

/// <summary>
/// Computes a calibration candidate for one process from past wafers: (1) each wafer's best-fit capture radius,
/// (2) the radius model fitted to all wires pooled, each wafer's Â taken at its own best L, both forms, selected by
/// AIC, (3) the Arrhenius fit of the located L's when the wafers span two or more temperatures. The result is only
/// a proposal: <see cref="ProcessModelState.Accept"/> by a person makes it current.
/// </summary>
public static class ProcessCalibrator
{
    /// <summary>Calibrates. Pure; the evaluators are called from this thread only.</summary>
    /// <exception cref="ArgumentException">No wafers, duplicate wafer ids, or invalid options.</exception>
    /// <exception cref="InvalidOperationException">A wafer has no L with enough usable wires.</exception>
    public static CalibrationRecord Calibrate(string candidateId, string process, DateTimeOffset createdAt, IReadOnlyList<WaferCalibrationInput> wafers, CalibrationOptions? options = null)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(candidateId);
        ArgumentException.ThrowIfNullOrWhiteSpace(process);
        ArgumentNullException.ThrowIfNull(wafers);
        options ??= new CalibrationOptions();
        options.Validate();
        if (wafers.Count == 0)
        {
            throw new ArgumentException("A calibration needs at least one wafer.", nameof(wafers));
        }
        if (wafers.Select(w => w.WaferId).Distinct(StringComparer.Ordinal).Count() != wafers.Count)
        {
            throw new ArgumentException("Each wafer may appear once in a calibration.", nameof(wafers));
        }

        var radii = new List<WaferCaptureRadius>(wafers.Count);
        var pooledAreas = new List<double>();
        var pooledRadii = new List<double>();
        var arrhenius = new List<ArrheniusPoint>();
        foreach (WaferCalibrationInput wafer in wafers)
        {
            CaptureRadiusFit best = BestCaptureRadius(wafer, options);
            radii.Add(new WaferCaptureRadius(wafer.WaferId, best.CaptureRadiusNm, best.Fit.RSquared, best.AtSearchEdge, best.Fit.Count));
            var areas = new double[wafer.RadiiNm.Length];
            wafer.Evaluator(best.CaptureRadiusNm, areas);
            for (int i = 0; i < areas.Length; i++)
            {
                if (double.IsFinite(areas[i]) && areas[i] > 0)
                {
                    pooledAreas.Add(areas[i]);
                    pooledRadii.Add(wafer.RadiiNm[i]);
                }
            }
            if (!best.AtSearchEdge)
            {
                arrhenius.Add(new ArrheniusPoint(wafer.WaferId, best.CaptureRadiusNm, wafer.GrowthDurationS, wafer.EffectiveTemperatureK, wafer.ConventionFactor));
            }
        }

        RadiusModelComparison model = RadiusModelFitter.FitAndSelect(pooledAreas.ToArray(), pooledRadii.ToArray());
        bool severalTemperatures = arrhenius.Select(p => p.EffectiveTemperatureK).Distinct().Count() >= 2;
        ArrheniusFit? fit = arrhenius.Count >= 2 && severalTemperatures ? ArrheniusCalibration.Fit(arrhenius) : null;
        int atEdge = radii.Count(r => r.AtSearchEdge);
        string note = fit is null
            ? "no Arrhenius fit: needs two or more wafers with a located L at different T_eff"
            : fit.Count == 2 ? "Arrhenius fit through two wafers: no interval" : $"Arrhenius fit over {fit.Count} wafers";
        if (atEdge > 0)
        {
            note += $"; {atEdge} wafer(s) with L at the search edge left out of the Arrhenius fit";
        }
        return new CalibrationRecord(candidateId, process, createdAt, wafers.Select(w => w.WaferId).ToArray(), model, radii, fit, note);
    }

    private static CaptureRadiusFit BestCaptureRadius(WaferCalibrationInput wafer, CalibrationOptions options)
    {
        CaptureRadiusFit Search(RadiusModelKind kind) =>
            CaptureRadiusSearch.Find(wafer.RadiiNm, wafer.Evaluator, kind, options.MinCaptureRadiusNm, options.MaxCaptureRadiusNm, options.ScanPoints);
        if (options.SearchModel is { } only)
        {
            return Search(only);
        }
        CaptureRadiusFit linear = Search(RadiusModelKind.Linear);
        CaptureRadiusFit power = Search(RadiusModelKind.PowerLaw);
        return power.Fit.RSquared > linear.Fit.RSquared ? power : linear;
    }
}
