namespace RunWatch.Core.Model;

/// <summary>
/// Arrhenius calibration of surface diffusion from wafers grown at different temperatures: each wafer's best-fit
/// capture radius L is taken as its diffusion length, so D = L²/(c·t) and ln D = ln D0 − Ea/(kB·T_eff).
/// Ordinary least squares of ln D on 1/T_eff; slope = −Ea/kB.
/// </summary>
public static class ArrheniusCalibration
{
    /// <summary>kB in eV/K, computed from the exact SI defining constants (1.380649e-23 J/K ÷ 1.602176634e-19 C).</summary>
    public const double BoltzmannEvPerK = Thermal.PhysicalConstants.BoltzmannEvPerK;

    private const double CentimetresPerNanometre = 1e-7;

    /// <summary>D = L²/(c·t) in cm²/s for one point: its capture radius taken as the diffusion length.</summary>
    public static double DiffusivityCmSqPerS(ArrheniusPoint point)
    {
        ArgumentNullException.ThrowIfNull(point);
        double lCm = point.CaptureRadiusNm * CentimetresPerNanometre;
        return lCm * lCm / (point.ConventionFactor * point.GrowthDurationS);
    }

    /// <summary>ln(D / (cm²/s)) for one point.</summary>
    public static double LnDiffusivity(ArrheniusPoint point) => Math.Log(DiffusivityCmSqPerS(point));

    /// <summary>
    /// Fits Ea and D0. Needs wafers at two or more distinct temperatures. With exactly two wafers the line passes
    /// through both points and has no residual degrees of freedom: standard errors and intervals are NaN.
    /// </summary>
    /// <exception cref="ArgumentException">Fewer than two points, one temperature only, or a point with a non-positive L, t, T or c.</exception>
    public static ArrheniusFit Fit(IReadOnlyList<ArrheniusPoint> points)
    {
        ArgumentNullException.ThrowIfNull(points);
        if (points.Count < 2)
        {
            throw new ArgumentException($"The Arrhenius fit needs at least 2 wafers at different temperatures; got {points.Count}.", nameof(points));
        }
        var inverseT = new double[points.Count];
        var lnD = new double[points.Count];
        var ids = new string[points.Count];
        for (int i = 0; i < points.Count; i++)
        {
            ArrheniusPoint p = points[i];
            if (!(p.CaptureRadiusNm > 0) || !(p.GrowthDurationS > 0) || !(p.EffectiveTemperatureK > 0) || !(p.ConventionFactor > 0))
            {
                throw new ArgumentException($"Wafer '{p.WaferId}' has a non-positive L, t, T_eff or c.", nameof(points));
            }
            inverseT[i] = 1 / p.EffectiveTemperatureK;
            lnD[i] = LnDiffusivity(p);
            ids[i] = p.WaferId;
        }
        LineFit line;
        try
        {
            line = points.Count == 2 ? TwoPointLine(inverseT, lnD) : LeastSquares.FitLine(inverseT, lnD);
        }
        catch (ArgumentException ex)
        {
            throw new ArgumentException("The Arrhenius fit needs wafers grown at two or more distinct temperatures.", nameof(points), ex);
        }
        double t = line.Count > 2 ? RadiusModelFitter.TQuantile(line.Count - 2) : double.NaN;
        double ea = -line.Slope * BoltzmannEvPerK;
        double eaSe = line.SlopeStandardError * BoltzmannEvPerK;
        var activation = new ParameterEstimate("Ea", ea, eaSe, ea - (t * eaSe), ea + (t * eaSe), "eV");
        double lnD0 = line.Intercept;
        double lnD0Se = line.InterceptStandardError;
        var lnPrefactor = new ParameterEstimate("ln D0", lnD0, lnD0Se, lnD0 - (t * lnD0Se), lnD0 + (t * lnD0Se), "ln(cm²/s)");
        double d0 = Math.Exp(lnD0);
        var prefactor = new ParameterEstimate("D0", d0, d0 * lnD0Se, Math.Exp(lnPrefactor.Lower95), Math.Exp(lnPrefactor.Upper95), "cm²/s");
        return new ArrheniusFit(activation, prefactor, lnPrefactor, line.Count, line.RSquared, line.ResidualStandardError, ids);
    }

    private static LineFit TwoPointLine(double[] x, double[] y)
    {
        if (x[0] == x[1])
        {
            throw new ArgumentException("Both wafers have the same T_eff: the slope is undetermined.");
        }
        double slope = (y[1] - y[0]) / (x[1] - x[0]);
        double intercept = y[0] - (slope * x[0]);
        double meanX = (x[0] + x[1]) / 2;
        return new LineFit(2, intercept, slope, double.NaN, double.NaN, 0, Math.Pow(y[1] - y[0], 2) / 2, double.NaN, 1, meanX, Math.Pow(x[1] - x[0], 2) / 2);
    }
}
