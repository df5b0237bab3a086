namespace RunWatch.Core.Wafers;

/// <summary>
/// How evenly a wafer grew, from the mean radius of each field and the field's distance from the wafer centre.
/// <para>
/// <b>Non-uniformity</b> U = (max − min) / (2 · mean) of the field mean radii: the half-range as a fraction of the
/// mean, the usual way of quoting across-wafer uniformity of a layer property as "± U" (COMMON PRACTICE, no single
/// source). The CV of the field means (sample SD / mean) is given beside it. The <b>radial trend</b> is the
/// least-squares line of field mean radius against distance from the centre (slope in nm per mm).
/// </para>
/// </summary>
/// <param name="Fields">Fields with a finite mean radius.</param>
/// <param name="MeanOfFieldMeansNm">Mean of the field mean radii, nm.</param>
/// <param name="NonUniformity">(max − min) / (2 · mean), a fraction; NaN for fewer than two fields.</param>
/// <param name="CvOfFieldMeans">Sample SD / mean of the field means; NaN for fewer than two fields.</param>
/// <param name="RadialSlopeNmPerMm">Slope of the radial trend; null without two different distances.</param>
/// <param name="RadialInterceptNm">Intercept of the radial trend (at the centre); null with the slope.</param>
public sealed record WaferUniformity(int Fields, double MeanOfFieldMeansNm, double NonUniformity, double CvOfFieldMeans, double? RadialSlopeNmPerMm, double? RadialInterceptNm)
{
    /// <summary>Computes the figures; pairs whose mean or distance is not finite are left out.</summary>
    /// <exception cref="ArgumentException">The spans differ in length.</exception>
    public static WaferUniformity From(ReadOnlySpan<double> distancesMm, ReadOnlySpan<double> fieldMeansNm)
    {
        if (distancesMm.Length != fieldMeansNm.Length)
        {
            throw new ArgumentException("Distances and field means differ in length.", nameof(fieldMeansNm));
        }
        int n = 0;
        double sum = 0;
        double min = double.PositiveInfinity;
        double max = double.NegativeInfinity;
        double sumD = 0;
        for (int i = 0; i < fieldMeansNm.Length; i++)
        {
            if (double.IsFinite(fieldMeansNm[i]) && double.IsFinite(distancesMm[i]))
            {
                n++;
                sum += fieldMeansNm[i];
                sumD += distancesMm[i];
                min = Math.Min(min, fieldMeansNm[i]);
                max = Math.Max(max, fieldMeansNm[i]);
            }
        }
        if (n == 0)
        {
            return new WaferUniformity(0, double.NaN, double.NaN, double.NaN, null, null);
        }
        double mean = sum / n;
        double meanD = sumD / n;
        double ss = 0;
        double sxx = 0;
        double sxy = 0;
        for (int i = 0; i < fieldMeansNm.Length; i++)
        {
            if (double.IsFinite(fieldMeansNm[i]) && double.IsFinite(distancesMm[i]))
            {
                double dy = fieldMeansNm[i] - mean;
                double dx = distancesMm[i] - meanD;
                ss += dy * dy;
                sxx += dx * dx;
                sxy += dx * dy;
            }
        }
        double nonUniformity = n >= 2 ? (max - min) / (2 * mean) : double.NaN;
        double cv = n >= 2 ? Math.Sqrt(ss / (n - 1)) / mean : double.NaN;
        // Ordinary least squares y = a + b·x (closed form); undefined when every field is at the same distance.
        double? slope = n >= 2 && sxx > 1e-12 ? sxy / sxx : null;
        double? intercept = slope is { } b ? mean - (b * meanD) : null;
        return new WaferUniformity(n, mean, nonUniformity, cv, slope, intercept);
    }

    /// <summary>Distance of a field from the wafer centre, mm (field positions are taken relative to the centre).</summary>
    public static double DistanceFromCentreMm(double xMm, double yMm) => Math.Sqrt((xMm * xMm) + (yMm * yMm));
}
