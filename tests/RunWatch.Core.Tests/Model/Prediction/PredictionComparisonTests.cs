using MathNet.Numerics;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using Xunit;

namespace RunWatch.Core.Tests.Model.Prediction;

public sealed class PredictionComparisonTests
{
    [Fact]
    public void Compare_KnownValues_GivesHandComputedBiasAndRmse()
    {
        // DERIVED by hand: model r = 10 + 20·Â; Â = (0, 0.5, 1) → p = (10, 20, 30); m = (12, 19, 33);
        // e = p − m = (−2, 1, −3): bias = −4/3, RMSE = √(14/3), MAE = 2; m̄ = 64/3, SST = (784 + 49 + 1225)/9 = 686/3 → r² = 1 − 14/(686/3).
        RadiusModelFit model = RadiusModelFitter.FitLinear([0, 1, 2], [10, 30, 50]);
        PredictedVsMeasured result = PredictionComparison.Compare(model, [0, 0.5, 1], [12, 19, 33]);
        Assert.Equal(-4.0 / 3, result.BiasNm, 12);
        Assert.Equal(Math.Sqrt(14.0 / 3), result.RmseNm, 12);
        Assert.Equal(2, result.MeanAbsoluteErrorNm, 12);
        Assert.Equal(1 - (14 / (686.0 / 3)), result.RSquared, 12);
        Assert.Equal([10, 20, 30], result.PredictedNm.Select(v => Math.Round(v, 9)));
    }

    [Fact]
    public void Compare_AgainstMathNetCoefficientOfDetermination_Agrees()
    {
        // Reference: MathNet.Numerics GoodnessOfFit.CoefficientOfDetermination (1 − SSres/SStot).
        (double[] x, double[] y) = Core.Tests.Model.SyntheticWafer.Make(RadiusModelKind.PowerLaw, 60, 0.5, 3, 70, 44);
        RadiusModelFit model = RadiusModelFitter.FitPowerLaw(x, y);
        PredictedVsMeasured result = PredictionComparison.Compare(model, x, y);
        Assert.Equal(GoodnessOfFit.CoefficientOfDetermination(result.PredictedNm, y), result.RSquared, 12);
    }

    [Fact]
    public void Compare_NaNArea_SkipsWire()
    {
        RadiusModelFit model = RadiusModelFitter.FitLinear([0, 1, 2], [10, 30, 50]);
        PredictedVsMeasured result = PredictionComparison.Compare(model, [0, double.NaN, 1, 0.5], [10, 99, 30, 20]);
        Assert.Equal(3, result.Count);
        Assert.True(double.IsNaN(result.PredictedNm[1]));
        Assert.Equal(0, result.BiasNm, 9);
    }
}
