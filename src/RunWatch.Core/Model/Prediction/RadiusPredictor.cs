using RunWatch.Core.Model;

namespace RunWatch.Core.Model.Prediction;

/// <summary>
/// Predicts a wafer's radius distribution before SEM: simulated nucleation fields give capture areas Â at L_eff,
/// the process model maps each Â to a radius. The spread is the geometric (site-to-site) spread only; the model's
/// residual scatter and parameter uncertainty are not added (stated in <see cref="RadiusPrediction.Note"/>).
/// </summary>
public static class RadiusPredictor
{
    /// <summary>The note stored with every prediction.</summary>
    public const string SpreadNote = "spread from simulated nucleation sites only; model residual scatter and parameter uncertainty not included";

    /// <summary>Runs the simulation. Deterministic for a given request and simulator.</summary>
    /// <exception cref="ArgumentException">Fewer than one field, a non-positive L or density.</exception>
    /// <exception cref="InvalidOperationException">The simulator produced fewer than two wires in total.</exception>
    public static RadiusPrediction Predict(RadiusPredictionRequest request, FieldSimulator simulator)
    {
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(simulator);
        ArgumentOutOfRangeException.ThrowIfLessThan(request.Fields, 1);
        if (!(request.CaptureRadiusNm > 0) || !(request.DensityPerCm2 > 0))
        {
            throw new ArgumentException($"L_eff and density must be positive; got {request.CaptureRadiusNm} nm, {request.DensityPerCm2} cm⁻².", nameof(request));
        }
        var areas = new List<double>();
        var radii = new List<double>();
        var fieldMeans = new List<double>(request.Fields);
        for (int f = 0; f < request.Fields; f++)
        {
            areas.Clear();
            simulator(unchecked(request.Seed + f), areas);
            if (areas.Count == 0)
            {
                continue;
            }
            double sum = 0;
            foreach (double a in areas)
            {
                double r = request.Model.Predict(a);
                radii.Add(r);
                sum += r;
            }
            fieldMeans.Add(sum / areas.Count);
        }
        if (radii.Count < 2)
        {
            throw new InvalidOperationException($"The field simulator produced {radii.Count} wires in {request.Fields} fields; enlarge the field or check L and density.");
        }
        double[] sorted = radii.ToArray();
        Array.Sort(sorted);
        (double mean, double sd) = MeanAndSd(sorted);
        (_, double fieldSd) = fieldMeans.Count > 1 ? MeanAndSd(fieldMeans.ToArray()) : (0, double.NaN);
        return new RadiusPrediction(
            mean,
            sd,
            sd / mean,
            Quantile(sorted, 0.05),
            Quantile(sorted, 0.50),
            Quantile(sorted, 0.95),
            fieldSd,
            sorted.Length,
            request.Fields,
            request.Seed,
            request.CaptureRadiusNm,
            request.DensityPerCm2,
            request.Model.Kind,
            SpreadNote);
    }

    /// <summary>Linear-interpolation quantile of sorted data (type 7 of Hyndman &amp; Fan, 1996; numpy's default).</summary>
    internal static double Quantile(ReadOnlySpan<double> sorted, double q)
    {
        double h = (sorted.Length - 1) * q;
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, sorted.Length - 1);
        return sorted[lo] + ((h - lo) * (sorted[hi] - sorted[lo]));
    }

    private static (double Mean, double Sd) MeanAndSd(ReadOnlySpan<double> values)
    {
        double mean = 0;
        foreach (double v in values)
        {
            mean += v;
        }
        mean /= values.Length;
        double ss = 0;
        foreach (double v in values)
        {
            ss += (v - mean) * (v - mean);
        }
        return (mean, Math.Sqrt(ss / (values.Length - 1)));
    }
}
