using RunWatch.Core.Thermal;

namespace RunWatch.Core.Excursions;

/// <summary>
/// The part of an excursion's effect that falls inside the growth window. L_eff integrates D(T) over the growth
/// window only, so a deviation before it (the heating ramp, a pre-bake) or after it changes nothing; an excursion
/// that straddles a window edge counts only for its overlap. Pure computation over sample arrays.
/// </summary>
public static class ExcursionWindowEffect
{
    /// <summary>
    /// ∫ (D(T(t)) − D(T_setpoint(t))) dt over [start, end] ∩ [windowStart, windowEnd], cm², with T and the setpoint
    /// linear between samples (segments cut at the interval's ends by linear interpolation) and segments longer than
    /// <paramref name="maxGapS"/> left out, as the window integral leaves them out.
    /// </summary>
    /// <param name="timesS">Sample times, s, ascending.</param>
    /// <param name="temperaturesC">True temperature at each sample, °C.</param>
    /// <param name="setpointsC">Setpoint in force at each sample, °C (NaN where none: such segments count nothing).</param>
    /// <param name="startS">Excursion start, s.</param>
    /// <param name="endS">Excursion end, s.</param>
    /// <param name="windowStartS">Growth window start, s.</param>
    /// <param name="windowEndS">Growth window end, s.</param>
    /// <param name="diffusivity">Arrhenius diffusivity of the process.</param>
    /// <param name="maxGapS">Longest segment still integrated, s.</param>
    public static double ExcessIntegralCmSq(ReadOnlySpan<double> timesS, ReadOnlySpan<double> temperaturesC, ReadOnlySpan<double> setpointsC,
        double startS, double endS, double windowStartS, double windowEndS, ArrheniusDiffusivity diffusivity, double maxGapS)
    {
        if (timesS.Length != temperaturesC.Length || timesS.Length != setpointsC.Length)
        {
            throw new ArgumentException("Times, temperatures and setpoints must have the same length.");
        }
        double from = Math.Max(startS, windowStartS);
        double to = Math.Min(endS, windowEndS);
        if (!(to > from) || timesS.Length < 2)
        {
            return 0;
        }
        double activationK = diffusivity.ActivationTemperatureK;
        double sumS = 0;
        for (int i = 1; i < timesS.Length; i++)
        {
            double t0 = timesS[i - 1];
            double t1 = timesS[i];
            double dt = t1 - t0;
            if (t1 <= from || t0 >= to || !(dt > 0) || dt > maxGapS || !double.IsFinite(setpointsC[i - 1]) || !double.IsFinite(setpointsC[i]))
            {
                continue;
            }
            double a = Math.Max(t0, from);
            double b = Math.Min(t1, to);
            double actualA = Lerp(t0, t1, temperaturesC[i - 1], temperaturesC[i], a) + PhysicalConstants.ZeroCelsiusK;
            double actualB = Lerp(t0, t1, temperaturesC[i - 1], temperaturesC[i], b) + PhysicalConstants.ZeroCelsiusK;
            double setA = Lerp(t0, t1, setpointsC[i - 1], setpointsC[i], a) + PhysicalConstants.ZeroCelsiusK;
            double setB = Lerp(t0, t1, setpointsC[i - 1], setpointsC[i], b) + PhysicalConstants.ZeroCelsiusK;
            sumS += ThermalIntegrator.SegmentIntegralS(b - a, actualA, actualB, activationK) - ThermalIntegrator.SegmentIntegralS(b - a, setA, setB, activationK);
        }
        return diffusivity.D0CmSqPerS * sumS;
    }

    private static double Lerp(double t0, double t1, double v0, double v1, double t) => t1 == t0 ? v0 : v0 + ((v1 - v0) * (t - t0) / (t1 - t0));
}
