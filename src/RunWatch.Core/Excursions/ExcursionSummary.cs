using RunWatch.Core.Thermal;

namespace RunWatch.Core.Excursions;

/// <summary>
/// One qualified excursion from the setpoint: from the first sample beyond the warning band to the first sample
/// back inside the band less the hysteresis.
/// </summary>
/// <param name="StartS">First sample beyond the warning band, s.</param>
/// <param name="EndS">First sample back within band − hysteresis (or the run end / end of data), s.</param>
/// <param name="PeakDeviationK">Signed deviation reading − setpoint with the largest magnitude, K.</param>
/// <param name="PeakTimeS">When the peak occurred, s.</param>
/// <param name="PeakValueC">The reading at the peak, °C.</param>
/// <param name="Severity">Highest band reached.</param>
/// <param name="ExcessIntegralCmSq">
/// ∫D dt with the excursion's samples minus ∫D dt with those samples replaced by the setpoint, cm²
/// (NaN when the monitor has no diffusivity).
/// </param>
/// <param name="Closed">False when the data ended (or the run ended) while the excursion was still open.</param>
/// <param name="SuppressedByDesign">
/// True when the whole excursion fell in a state where deviation alarms are suppressed by design (a ramp towards a
/// new setpoint): kept for the record, not counted as an alarm-worthy excursion.
/// </param>
public readonly record struct ExcursionSummary(
    double StartS,
    double EndS,
    double PeakDeviationK,
    double PeakTimeS,
    double PeakValueC,
    ExcursionSeverity Severity,
    double ExcessIntegralCmSq,
    bool Closed,
    bool SuppressedByDesign = false)
{
    /// <summary>Duration in s.</summary>
    public double DurationS => EndS - StartS;

    /// <summary>
    /// The change it caused in L_eff, µm: L_eff(actual) − L_eff(excursion replaced by the setpoint), for a window
    /// whose total ∫D dt is <paramref name="windowIntegralCmSq"/>.
    /// </summary>
    public double LengthChangeUm(double windowIntegralCmSq, double conventionFactor) =>
        DiffusionLength.LengthChangeUm(windowIntegralCmSq, ExcessIntegralCmSq, conventionFactor);
}
