using RunWatch.Core.Geometry;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Diffusion;
using RunWatch.Core.Thermal;
using RunWatch.Testing.Physics;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Core.Tests.Model.Diffusion;

/// <summary>
/// Transfer: truth from the independent adatom random-walk simulation (tests/RunWatch.Testing/Physics) at three
/// temperatures and times with measurement noise; the diffusion model is fitted on them and predicts a fourth wafer
/// grown at another temperature for another time with an excursion. The Â regression (normalised Voronoi ∩ disc
/// area, L from the Arrhenius calibration) gets the same data and is shown failing.
/// </summary>
public sealed class DiffusionModelTransferTests(ITestOutputHelper output)
{
    [Fact]
    public void Fit_ThreeTemperaturesFromRandomWalkTruth_PredictsFourthWaferWithExcursionWithin3Percent()
    {
        var records = new[]
        {
            GrowthTruth.Record(590, 1800, 1),
            GrowthTruth.Record(610, 1200, 2),
            GrowthTruth.Record(630, 2400, 3),
        };
        var wafers = new List<DiffusionWafer>();
        var raw = new List<(Point2D[] Centres, double[] RadiiNm, CaptureField Field)>();
        for (int k = 0; k < records.Length; k++)
        {
            var w = GrowthTruth.Wafer(records[k], GrowthTruth.Law, 100 + k);
            raw.Add(w);
            wafers.Add(GrowthTruth.ModelWafer($"W{k + 1}", records[k], w));
        }
        ThermalRecord heldOutRecord = GrowthTruth.Record(600, 1000, 4, excursionStartS: 400, excursionS: 180, excursionK: 25);
        var heldOut = GrowthTruth.Wafer(heldOutRecord, GrowthTruth.Law, 104);
        DiffusionWafer heldOutWafer = GrowthTruth.ModelWafer("W4", heldOutRecord, heldOut);

        DiffusionFitResult fit = DiffusionModelFitter.Fit(wafers);

        Assert.True(fit.Succeeded, fit.Refusal);
        DiffusionRadiusModel model = fit.Model!;
        foreach (ParameterEstimate p in model.Parameters)
        {
            output.WriteLine($"{p.Name} = {p.Value:G4} [{p.Lower95:G4}, {p.Upper95:G4}] {p.Unit}");
        }
        foreach (DiffusionWaferFigures f in fit.Wafers)
        {
            output.WriteLine($"{f.Id}: n {f.WiresUsed}, {f.MeanTemperatureC:F1} °C, λ {f.LambdaAtMeanUm:F3} µm, λ_eff {f.LambdaEffUm:F3}, measured {f.MeanMeasuredNm:F2}, predicted {f.MeanPredictedNm:F2}, slope {f.MedianLogSlope:F2}");
        }
        double truthLambda610 = GrowthTruth.Law.LambdaUm(PhysicalConstants.CelsiusToKelvin(610));
        output.WriteLine($"truth λ(610 °C) = {truthLambda610:F3} µm, model {model.LambdaAtUm(610):F3} µm; truth E_λ {GrowthTruth.Law.ActivationEv}, model {model.ActivationEv:F3}");

        (double bias, int n) = MeanBias(model, heldOutWafer);
        output.WriteLine($"held-out wafer (600 °C, 1000 s, +25 K for 3 min): diffusion model mean bias {bias:P2} over {n} wires");
        Assert.InRange(bias, -0.03, 0.03);

        double hatBias = HatRegressionBias(wafers, raw, records, heldOutWafer, heldOut, heldOutRecord);
        output.WriteLine($"Â regression on the same data: mean bias {hatBias:P2}");
        Assert.False(Math.Abs(hatBias) <= 0.03, $"the Â regression was expected to miss by more than 3 % but gave {hatBias:P2}");
    }

    private static (double Bias, int Count) MeanBias(DiffusionRadiusModel model, DiffusionWafer wafer)
    {
        var integrals = new double[wafer.Table.WireCount];
        var predicted = new double[wafer.Table.WireCount];
        double outside = model.Predict(wafer.Table, wafer.Exposure, integrals, predicted);
        Assert.Equal(0, outside);
        var guarded = new bool[wafer.Table.WireCount];
        wafer.Table.GuardFor(wafer.Exposure.LambdaRange(model.Law).Max, guarded);
        double sumP = 0, sumM = 0;
        int n = 0;
        for (int i = 0; i < predicted.Length; i++)
        {
            if (!guarded[i])
            {
                sumP += predicted[i];
                sumM += wafer.MeasuredRadiiNm[i];
                n++;
            }
        }
        Assert.True(n >= 15, $"only {n} unguarded wires");
        return ((sumP - sumM) / sumM, n);
    }

    /// <summary>
    /// The previous model on the same data: best-fit L per wafer, Arrhenius line through D = L²/t, pooled radius
    /// regression on Â; the fourth wafer predicted at L = √(∫D dt) of its own history.
    /// </summary>
    private static double HatRegressionBias(List<DiffusionWafer> wafers, List<(Point2D[] Centres, double[] RadiiNm, CaptureField Field)> raw,
        ThermalRecord[] records, DiffusionWafer heldOutWafer, (Point2D[] Centres, double[] RadiiNm, CaptureField Field) heldOut, ThermalRecord heldOutRecord)
    {
        var inputs = new List<WaferCalibrationInput>();
        for (int k = 0; k < wafers.Count; k++)
        {
            inputs.Add(new WaferCalibrationInput(wafers[k].Id, raw[k].RadiiNm, Evaluator(raw[k]), records[k].TimesS[^1],
                wafers[k].Exposure.MeanTemperatureK, 1.0));
        }
        // Search L from 150 nm (below that every zone is a whole disc and Â carries no information) to 20 µm.
        CalibrationRecord record = ProcessCalibrator.Calibrate("c1", "p", DateTimeOffset.UnixEpoch, inputs, new CalibrationOptions { MinCaptureRadiusNm = 150 });
        if (record.Arrhenius is null || record.RadiusModel is null)
        {
            return double.NaN;
        }
        ArrheniusDiffusivity d = record.Arrhenius.ToDiffusivity();
        double integral = ThermalIntegrator.Integrate(heldOutRecord.TimesS, heldOutRecord.ReadingsC, TemperatureCalibration.Identity, d,
            0, heldOutRecord.TimesS[^1], 10).IntegralCmSq;
        double lengthNm = Math.Sqrt(integral) * 1e7;
        var hat = new double[heldOut.Centres.Length];
        Evaluator(heldOut)(lengthNm, hat);
        double sumP = 0, sumM = 0;
        for (int i = 0; i < hat.Length; i++)
        {
            if (double.IsFinite(hat[i]))
            {
                sumP += record.RadiusModel.SelectedFit.Predict(hat[i]);
                sumM += heldOut.RadiiNm[i];
            }
        }
        return sumM > 0 ? (sumP - sumM) / sumM : double.NaN;
    }

    private static CaptureAreaEvaluator Evaluator((Point2D[] Centres, double[] RadiiNm, CaptureField Field) w)
    {
        Point2D[] nm = w.Centres.Select(p => new Point2D(p.X * 1000, p.Y * 1000)).ToArray();
        var field = CaptureField.Rectangle(w.Field.Width * 1000, w.Field.Height * 1000);
        return MeasuredCaptureAreas.ForFields([new MeasuredField(field, nm)], GuardRule.UnseenNeighbourCouldCut);
    }
}
