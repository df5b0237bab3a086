namespace RunWatch.Core.Thermal;

/// <summary>Computes <see cref="DiffusionLengthResult"/> for a growth window of a thermal record. Pure and thread-safe.</summary>
public static class DiffusionLengthCalculator
{
    /// <summary>
    /// L_eff, T_eff, coverage and gaps for <paramref name="window"/> of <paramref name="record"/>; L_nom when
    /// <paramref name="plan"/> is given; λ_eff when <paramref name="lifetime"/> is given.
    /// </summary>
    /// <exception cref="ArgumentException">Invalid options, process parameters or window.</exception>
    public static DiffusionLengthResult Compute(
        ThermalRecord record,
        ArrheniusDiffusivity diffusivity,
        GrowthWindow window,
        DiffusionLengthOptions options,
        TemperatureCalibration? calibration = null,
        GrowthPlan? plan = null,
        LifetimeModel? lifetime = null)
    {
        ArgumentNullException.ThrowIfNull(record);
        ArgumentNullException.ThrowIfNull(options);
        var problems = options.Validate().Concat(diffusivity.Validate()).Concat(lifetime?.Validate() ?? []).ToList();
        if (!double.IsFinite(window.StartS) || !double.IsFinite(window.EndS) || window.EndS < window.StartS)
        {
            problems.Add($"The growth window [{window.StartS}, {window.EndS}] s is not a finite interval.");
        }
        if (plan is { } p && (!double.IsFinite(p.SetpointC) || !(p.PlannedS >= 0)))
        {
            problems.Add("The plan needs a finite setpoint and a non-negative planned duration.");
        }
        if (problems.Count > 0)
        {
            throw new ArgumentException(string.Join(" ", problems));
        }

        calibration ??= TemperatureCalibration.Identity;
        double maxGapS = options.MaxGap.TotalSeconds;
        double c = options.ConventionFactor;
        var gaps = new List<RecordGap>();
        IntegrationResult integral = ThermalIntegrator.Integrate(
            record.TimesS, record.ReadingsC, calibration, diffusivity, window.StartS, window.EndS, maxGapS, gaps);

        double tEffK = DiffusionLength.EffectiveTemperatureK(diffusivity, integral.IntegralCmSq, integral.CoveredS);
        double? lifetimeUm = null;
        if (lifetime is { } tau && integral.CoveredS > 0)
        {
            IntegrationResult product = ThermalIntegrator.Integrate(
                record.TimesS, record.ReadingsC, calibration, tau.ProductWith(diffusivity), window.StartS, window.EndS, maxGapS);
            lifetimeUm = DiffusionLength.LengthUm(product.IntegralCmSq / product.CoveredS, c);
        }

        return new DiffusionLengthResult
        {
            ConventionFactor = c,
            Diffusivity = diffusivity,
            Window = window,
            IntegralCmSq = integral.IntegralCmSq,
            CoveredS = integral.CoveredS,
            CoveragePercent = integral.CoveragePercent,
            Gaps = gaps,
            MaxGapS = maxGapS,
            EffectiveLengthUm = DiffusionLength.LengthUm(integral.IntegralCmSq, c),
            EffectiveTemperatureC = PhysicalConstants.KelvinToCelsius(tEffK),
            LogSensitivityPerK = double.IsNaN(tEffK) ? double.NaN : DiffusionLength.LogSensitivityPerK(diffusivity.EaEv, tEffK),
            Plan = plan,
            NominalLengthUm = plan is { } q ? DiffusionLength.NominalLengthUm(diffusivity, q.SetpointC, q.PlannedS, c) : null,
            LifetimeLimitedLengthUm = lifetimeUm,
        };
    }
}
