using RunWatch.Core.Thermal;

namespace RunWatch.Core.Model.Diffusion;

/// <summary>
/// What one temperature excursion did to a field's predicted mean radius: the mean over the unguarded wires of
/// r(real history) − r(history with the excursion's samples read as the setpoint), in nm, with the same change in λ_eff.
/// </summary>
/// <param name="Excursion">The excursion's span on the record's time axis.</param>
/// <param name="MeanRadiusChangeNm">Change of the mean predicted radius (positive: the excursion made wires thicker).</param>
/// <param name="LambdaEffChangeUm">λ_eff(real) − λ_eff(without the excursion).</param>
public sealed record ExcursionRadiusEffect(GrowthWindow Excursion, double MeanRadiusChangeNm, double LambdaEffChangeUm)
{
    /// <summary>Effects of each excursion in <paramref name="excursions"/> (each replaced alone) on a field.</summary>
    public static IReadOnlyList<ExcursionRadiusEffect> Compute(DiffusionRadiusModel model, CaptureAreaTable table, ThermalRecord record,
        TemperatureCalibration calibration, GrowthWindow window, double setpointC, IReadOnlyList<GrowthWindow> excursions, double maxGapS = 10)
    {
        ArgumentNullException.ThrowIfNull(excursions);
        FieldPrediction real = FieldPrediction.Compute(model, table, ThermalExposure.FromRecord(record, calibration, window, maxGapS));
        var effects = new List<ExcursionRadiusEffect>();
        foreach (GrowthWindow excursion in excursions)
        {
            ThermalExposure without = ThermalExposure.FromRecord(record, calibration, window, maxGapS, [excursion], setpointC);
            var integrals = new double[table.WireCount];
            var radii = new double[table.WireCount];
            model.Predict(table, without, integrals, radii);
            double sumReal = 0, sumWithout = 0;
            int n = 0;
            for (int i = 0; i < radii.Length; i++)
            {
                if (!real.Guarded[i])
                {
                    sumReal += real.PredictedRadiiNm[i];
                    sumWithout += radii[i];
                    n++;
                }
            }
            double lambdaEffWithout = EffectiveCaptureLength.Find(table, real.Guarded, EffectiveCaptureLength.UnguardedTotal(real.Guarded, integrals), without.CoveredS);
            effects.Add(new ExcursionRadiusEffect(excursion, n > 0 ? (sumReal - sumWithout) / n : double.NaN, real.LambdaEffUm - lambdaEffWithout));
        }
        return effects;
    }
}
