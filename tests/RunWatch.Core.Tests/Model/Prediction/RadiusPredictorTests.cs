using MathNet.Numerics.Statistics;
using RunWatch.Core.Model;
using RunWatch.Core.Model.Prediction;
using Xunit;

namespace RunWatch.Core.Tests.Model.Prediction;

public sealed class RadiusPredictorTests
{
    private static readonly RadiusModelFit Linear = RadiusModelFitter.FitLinear([0.1, 0.5, 0.9, 0.3], [14, 30, 46, 22]);

    /// <summary>A stand-in simulator: Â drawn uniformly from the seed, so expected statistics are computable directly.</summary>
    private static void UniformAreas(int seed, List<double> areas)
    {
        var random = new Random(seed);
        for (int i = 0; i < 50; i++)
        {
            areas.Add(0.05 + (0.9 * random.NextDouble()));
        }
    }

    [Fact]
    public void Predict_StandInSimulator_StatisticsMatchMathNetOnTheSameRadii()
    {
        // Reference: MathNet.Numerics Statistics (Mean, StandardDeviation, Quantile R7 = linear interpolation).
        var request = new RadiusPredictionRequest(Linear, 400, 2e8, 8, 100);
        RadiusPrediction prediction = RadiusPredictor.Predict(request, UniformAreas);

        var radii = new List<double>();
        var fieldMeans = new List<double>();
        for (int f = 0; f < 8; f++)
        {
            var areas = new List<double>();
            UniformAreas(100 + f, areas);
            double[] r = areas.Select(Linear.Predict).ToArray();
            radii.AddRange(r);
            fieldMeans.Add(r.Mean());
        }
        Assert.Equal(radii.Mean(), prediction.MeanRadiusNm, 10);
        Assert.Equal(radii.StandardDeviation(), prediction.RadiusSdNm, 10);
        Assert.Equal(radii.QuantileCustom(0.05, QuantileDefinition.R7), prediction.P05Nm, 10);
        Assert.Equal(radii.QuantileCustom(0.95, QuantileDefinition.R7), prediction.P95Nm, 10);
        Assert.Equal(radii.Median(), prediction.P50Nm, 10);
        Assert.Equal(fieldMeans.StandardDeviation(), prediction.FieldMeanSdNm, 10);
        Assert.Equal(400, prediction.WireCount);
        Assert.Equal(RadiusPredictor.SpreadNote, prediction.Note);
    }

    [Fact]
    public void Predict_SameSeed_IsReproducible_OtherSeedDiffers()
    {
        RadiusPrediction a = RadiusPredictor.Predict(new RadiusPredictionRequest(Linear, 400, 2e8, 4, 7), UniformAreas);
        RadiusPrediction b = RadiusPredictor.Predict(new RadiusPredictionRequest(Linear, 400, 2e8, 4, 7), UniformAreas);
        RadiusPrediction c = RadiusPredictor.Predict(new RadiusPredictionRequest(Linear, 400, 2e8, 4, 8), UniformAreas);
        Assert.Equal(a, b);
        Assert.NotEqual(a.MeanRadiusNm, c.MeanRadiusNm);
    }

    [Fact]
    public void Predict_SimulatorYieldsNoWires_ThrowsClearError()
    {
        static void Empty(int seed, List<double> areas)
        {
        }
        var ex = Assert.Throws<InvalidOperationException>(() => RadiusPredictor.Predict(new RadiusPredictionRequest(Linear, 400, 2e8, 3, 1), Empty));
        Assert.Contains("0 wires", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Predict_NonPositiveL_Throws()
    {
        Assert.Throws<ArgumentException>(() => RadiusPredictor.Predict(new RadiusPredictionRequest(Linear, 0, 2e8, 3, 1), UniformAreas));
    }
}
