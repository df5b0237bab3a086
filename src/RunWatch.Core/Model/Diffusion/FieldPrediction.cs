namespace RunWatch.Core.Model.Diffusion;

/// <summary>The model applied to one measured field over one history.</summary>
/// <param name="PredictedRadiiNm">Predicted radius per wire (table order).</param>
/// <param name="IntegralsUm2S">∫A dt per wire.</param>
/// <param name="Guarded">Wires whose collection depends on what lies outside the image, at the largest λ of the history.</param>
/// <param name="LambdaMinUm">Smallest λ of the history.</param>
/// <param name="LambdaMaxUm">Largest λ of the history.</param>
/// <param name="LambdaAtMeanUm">λ at the time-weighted mean temperature.</param>
/// <param name="LambdaEffUm">λ_eff (see <see cref="EffectiveCaptureLength"/>); NaN when no wire is unguarded.</param>
/// <param name="SecondsOutsideTable">Growth seconds whose λ fell outside the table (clamped; 0 normally).</param>
public sealed record FieldPrediction(
    double[] PredictedRadiiNm,
    double[] IntegralsUm2S,
    bool[] Guarded,
    double LambdaMinUm,
    double LambdaMaxUm,
    double LambdaAtMeanUm,
    double LambdaEffUm,
    double SecondsOutsideTable)
{
    /// <summary>Mean predicted radius of the unguarded wires (NaN when none).</summary>
    public double MeanUnguardedNm
    {
        get
        {
            double sum = 0;
            int n = 0;
            for (int i = 0; i < Guarded.Length; i++)
            {
                if (!Guarded[i])
                {
                    sum += PredictedRadiiNm[i];
                    n++;
                }
            }
            return n > 0 ? sum / n : double.NaN;
        }
    }

    /// <summary>Applies <paramref name="model"/> to <paramref name="table"/> over <paramref name="exposure"/>.</summary>
    public static FieldPrediction Compute(DiffusionRadiusModel model, CaptureAreaTable table, ThermalExposure exposure)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(exposure);
        var integrals = new double[table.WireCount];
        var radii = new double[table.WireCount];
        double outside = model.Predict(table, exposure, integrals, radii);
        (double min, double max) = exposure.LambdaRange(model.Law);
        var guarded = new bool[table.WireCount];
        table.GuardFor(max, guarded);
        double lambdaEff = EffectiveCaptureLength.Find(table, guarded, EffectiveCaptureLength.UnguardedTotal(guarded, integrals), exposure.CoveredS);
        return new FieldPrediction(radii, integrals, guarded, min, max, model.Law.LambdaUm(exposure.MeanTemperatureK), lambdaEff, outside);
    }
}
