using RunWatch.Core.Model;

namespace RunWatch.Core.Model.Prediction;

/// <summary>After SEM: predicts each wire's radius from its measured neighbourhood (its Â) and compares.</summary>
public static class PredictionComparison
{
    /// <summary>Compares; wires with a non-finite Â or radius are skipped (their prediction is NaN).</summary>
    /// <exception cref="ArgumentException">Lengths differ, or fewer than two comparable wires.</exception>
    public static PredictedVsMeasured Compare(RadiusModelFit model, ReadOnlySpan<double> normalisedAreas, ReadOnlySpan<double> measuredRadiiNm)
    {
        ArgumentNullException.ThrowIfNull(model);
        if (normalisedAreas.Length != measuredRadiiNm.Length)
        {
            throw new ArgumentException($"Â has {normalisedAreas.Length} values but r has {measuredRadiiNm.Length}.", nameof(measuredRadiiNm));
        }
        var predicted = new double[normalisedAreas.Length];
        int n = 0;
        double sumMeasured = 0;
        for (int i = 0; i < predicted.Length; i++)
        {
            bool usable = double.IsFinite(normalisedAreas[i]) && double.IsFinite(measuredRadiiNm[i])
                && (model.Kind == RadiusModelKind.Linear || normalisedAreas[i] >= 0);
            predicted[i] = usable ? model.Predict(normalisedAreas[i]) : double.NaN;
            if (usable)
            {
                n++;
                sumMeasured += measuredRadiiNm[i];
            }
        }
        if (n < 2)
        {
            throw new ArgumentException($"Need at least 2 wires with finite Â and radius; got {n}.", nameof(normalisedAreas));
        }
        return Agreement(predicted, measuredRadiiNm, n, sumMeasured / n);
    }

    /// <summary>
    /// Compares radii already predicted by any model (the diffusion model's, for one); wires with a non-finite
    /// prediction or radius are skipped (their prediction is NaN in the result).
    /// </summary>
    /// <exception cref="ArgumentException">Lengths differ, or fewer than two comparable wires.</exception>
    public static PredictedVsMeasured CompareRadii(ReadOnlySpan<double> predictedRadiiNm, ReadOnlySpan<double> measuredRadiiNm)
    {
        if (predictedRadiiNm.Length != measuredRadiiNm.Length)
        {
            throw new ArgumentException($"{predictedRadiiNm.Length} predictions but {measuredRadiiNm.Length} radii.", nameof(measuredRadiiNm));
        }
        var predicted = new double[predictedRadiiNm.Length];
        int n = 0;
        double sumMeasured = 0;
        for (int i = 0; i < predicted.Length; i++)
        {
            bool usable = double.IsFinite(predictedRadiiNm[i]) && double.IsFinite(measuredRadiiNm[i]);
            predicted[i] = usable ? predictedRadiiNm[i] : double.NaN;
            if (usable)
            {
                n++;
                sumMeasured += measuredRadiiNm[i];
            }
        }
        if (n < 2)
        {
            throw new ArgumentException($"Need at least 2 wires with a finite prediction and radius; got {n}.", nameof(predictedRadiiNm));
        }
        return Agreement(predicted, measuredRadiiNm, n, sumMeasured / n);
    }

    private static PredictedVsMeasured Agreement(double[] predicted, ReadOnlySpan<double> measuredRadiiNm, int n, double meanMeasured)
    {
        double ssErr = 0;
        double ssTot = 0;
        double bias = 0;
        double abs = 0;
        for (int i = 0; i < predicted.Length; i++)
        {
            if (double.IsNaN(predicted[i]))
            {
                continue;
            }
            double e = predicted[i] - measuredRadiiNm[i];
            ssErr += e * e;
            bias += e;
            abs += Math.Abs(e);
            ssTot += (measuredRadiiNm[i] - meanMeasured) * (measuredRadiiNm[i] - meanMeasured);
        }
        double r2 = ssTot > 0 ? 1 - (ssErr / ssTot) : double.NaN;
        return new PredictedVsMeasured(predicted, n, r2, Math.Sqrt(ssErr / n), bias / n, abs / n);
    }
}
