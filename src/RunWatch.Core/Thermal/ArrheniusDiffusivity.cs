namespace RunWatch.Core.Thermal;

/// <summary>
/// Arrhenius surface diffusivity D(T) = D0·exp(−Ea/(kB·T)) of one process (adatom species on one surface).
/// </summary>
/// <param name="D0CmSqPerS">Pre-exponential factor D0 in cm²/s (positive, finite).</param>
/// <param name="EaEv">Activation energy Ea in eV (non-negative, finite).</param>
public readonly record struct ArrheniusDiffusivity(double D0CmSqPerS, double EaEv)
{
    /// <summary>Ea/kB in kelvin: the exponent's scale, D = D0·exp(−ActivationTemperatureK/T).</summary>
    public double ActivationTemperatureK => EaEv / PhysicalConstants.BoltzmannEvPerK;

    /// <summary>D at <paramref name="temperatureK"/> in cm²/s.</summary>
    public double DiffusivityCmSqPerS(double temperatureK) => D0CmSqPerS * Math.Exp(-ActivationTemperatureK / temperatureK);

    /// <summary>The temperature in kelvin at which D equals <paramref name="diffusivityCmSqPerS"/> (Arrhenius inverted).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not in (0, D0) or Ea is zero.</exception>
    public double TemperatureForDiffusivityK(double diffusivityCmSqPerS)
    {
        if (!(diffusivityCmSqPerS > 0) || !(diffusivityCmSqPerS < D0CmSqPerS) || !(EaEv > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(diffusivityCmSqPerS), diffusivityCmSqPerS, "D must lie in (0, D0) and Ea must be positive to invert Arrhenius.");
        }
        return ActivationTemperatureK / Math.Log(D0CmSqPerS / diffusivityCmSqPerS);
    }

    /// <summary>d(ln D)/dT = Ea/(kB·T²) in 1/K at <paramref name="temperatureK"/>.</summary>
    public double LogSensitivityPerK(double temperatureK) => ActivationTemperatureK / (temperatureK * temperatureK);

    /// <summary>
    /// The process whose D at <paramref name="temperatureK"/> equals <paramref name="diffusivityCmSqPerS"/>, for a given Ea:
    /// D0 = D·exp(Ea/(kB·T)).
    /// </summary>
    public static ArrheniusDiffusivity FromReference(double diffusivityCmSqPerS, double temperatureK, double eaEv) =>
        new(diffusivityCmSqPerS * Math.Exp(eaEv / (PhysicalConstants.BoltzmannEvPerK * temperatureK)), eaEv);

    /// <summary>Returns the problems with this process's parameters; empty when valid.</summary>
    public IReadOnlyList<string> Validate()
    {
        var errors = new List<string>();
        if (!(D0CmSqPerS > 0) || !double.IsFinite(D0CmSqPerS))
        {
            errors.Add($"D0 must be a positive finite number of cm²/s (got {D0CmSqPerS}).");
        }
        if (!(EaEv >= 0) || !double.IsFinite(EaEv))
        {
            errors.Add($"Ea must be a non-negative finite number of eV (got {EaEv}).");
        }
        return errors;
    }
}
