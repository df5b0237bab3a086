namespace RunWatch.Web.Data.InMemory;

/// <summary>
/// Ordinary least squares for the in-memory source's refit: r = A + B·Â, or ln r = ln A + B·ln Â for the power law.
/// The store-backed source uses the process model of the verdict pipeline instead.
/// </summary>
internal static class RadiusLeastSquares
{
    public static RadiusFit Fit(RadiusModelForm form, IReadOnlyList<ModelPoint> data, DateTimeOffset at)
    {
        if (data.Count < 3)
        {
            throw new InvalidOperationException($"A refit needs at least 3 wires; the process has {data.Count}.");
        }
        bool power = form == RadiusModelForm.PowerLaw;
        int n = data.Count;
        double sx = 0, sy = 0, sxx = 0, sxy = 0;
        foreach (var p in data)
        {
            double x = power ? Math.Log(p.NormalisedCaptureArea) : p.NormalisedCaptureArea;
            double y = power ? Math.Log(p.RadiusNm) : p.RadiusNm;
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
        }
        double slope = ((n * sxy) - (sx * sy)) / ((n * sxx) - (sx * sx));
        double intercept = (sy - (slope * sx)) / n;
        double a = power ? Math.Exp(intercept) : intercept;
        double mean = data.Average(p => p.RadiusNm);
        double ssRes = 0, ssTot = 0;
        foreach (var p in data)
        {
            double predicted = power ? a * Math.Pow(p.NormalisedCaptureArea, slope) : a + (slope * p.NormalisedCaptureArea);
            ssRes += (p.RadiusNm - predicted) * (p.RadiusNm - predicted);
            ssTot += (p.RadiusNm - mean) * (p.RadiusNm - mean);
        }
        return new RadiusFit(form, a, slope, 1 - (ssRes / ssTot), Math.Sqrt(ssRes / n), n, at);
    }
}
