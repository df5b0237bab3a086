using MathNet.Numerics;
using RunWatch.Core.Model;
using Xunit;

namespace RunWatch.Core.Tests.Model;

public sealed class ArrheniusCalibrationTests
{
    [Fact]
    public void BoltzmannEvPerK_FromExactSiConstants_MatchesCodata2018AndRejects2014Value()
    {
        // CONFIRMED (secondary): kB = 1.380649e-23 J/K and e = 1.602176634e-19 C exact (SI 2019; CODATA 2018),
        // kB = 8.617333262e-5 eV/K. The CODATA 2014 value 8.6173303e-5 differs by 3.5e-7 relative.
        Assert.Equal(8.617333262e-5, ArrheniusCalibration.BoltzmannEvPerK, 8.617333262e-5 * 1e-9);
        Assert.True(Math.Abs((ArrheniusCalibration.BoltzmannEvPerK / 8.6173303e-5) - 1) > 1e-7);
    }

    private static ArrheniusPoint Point(string id, double ea, double d0, double temperatureK, double durationS, double c, double lnNoise = 0)
    {
        // DERIVED: L² = c·D(T)·t with D = D0·exp(−Ea/(kB·T)); L in nm from cm.
        double d = d0 * Math.Exp((-ea / (ArrheniusCalibration.BoltzmannEvPerK * temperatureK)) + lnNoise);
        double lNm = Math.Sqrt(c * d * durationS) * 1e7;
        return new ArrheniusPoint(id, lNm, durationS, temperatureK, c);
    }

    [Fact]
    public void Fit_ExactPoints_RecoversEaAndD0()
    {
        ArrheniusPoint[] points =
        [
            Point("W1", 1.2, 0.5, 853.15, 1800, 4),
            Point("W2", 1.2, 0.5, 873.15, 1500, 4),
            Point("W3", 1.2, 0.5, 893.15, 1200, 4),
            Point("W4", 1.2, 0.5, 913.15, 2000, 4),
        ];
        ArrheniusFit fit = ArrheniusCalibration.Fit(points);
        Assert.Equal(1.2, fit.ActivationEnergy.Value, 9);
        Assert.Equal(0.5, fit.Prefactor.Value, 8);
        Assert.Equal(["W1", "W2", "W3", "W4"], fit.WaferIds);
        Assert.Equal(0.5 * Math.Exp(-1.2 / (ArrheniusCalibration.BoltzmannEvPerK * 880)), fit.Diffusivity(880), 1e-20);
        // The thermal room's diffusivity from the fitted parameters gives the same D(T).
        Assert.Equal(fit.Diffusivity(880), fit.ToDiffusivity().DiffusivityCmSqPerS(880), fit.Diffusivity(880) * 1e-12);
    }

    [Fact]
    public void Fit_NoisyPoints_MatchesMathNetLineAndCoversTruth()
    {
        // Reference: MathNet.Numerics Fit.Line on (1/T, ln D); Ea = −slope·kB.
        var random = new Random(17);
        double[] temperatures = [843.15, 858.15, 873.15, 888.15, 903.15, 918.15];
        ArrheniusPoint[] points = temperatures
            .Select((t, i) => Point($"W{i}", 1.0, 0.05, t, 1800, 1, 0.05 * (random.NextDouble() - 0.5)))
            .ToArray();
        ArrheniusFit fit = ArrheniusCalibration.Fit(points);

        (double intercept, double slope) = Fit.Line(points.Select(p => 1 / p.EffectiveTemperatureK).ToArray(), points.Select(ArrheniusCalibration.LnDiffusivity).ToArray());
        Assert.Equal(-slope * ArrheniusCalibration.BoltzmannEvPerK, fit.ActivationEnergy.Value, 9);
        Assert.Equal(Math.Exp(intercept), fit.Prefactor.Value, 9);
        Assert.True(fit.ActivationEnergy.IntervalContains(1.0));
        Assert.True(fit.Prefactor.IntervalContains(0.05));
        // The D0 interval is the exponential of the ln D0 interval, so it is asymmetric about D0.
        Assert.Equal(Math.Exp(fit.LnPrefactor.Upper95), fit.Prefactor.Upper95, 12);
        Assert.True(fit.Prefactor.Upper95 - fit.Prefactor.Value > fit.Prefactor.Value - fit.Prefactor.Lower95);
    }

    [Fact]
    public void Fit_OneTemperatureOnly_ThrowsClearError()
    {
        ArrheniusPoint[] points = [Point("A", 1, 1, 873, 1000, 1), Point("B", 1, 1, 873, 1200, 1), Point("C", 1, 1, 873, 900, 1)];
        var ex = Assert.Throws<ArgumentException>(() => ArrheniusCalibration.Fit(points));
        Assert.Contains("distinct temperatures", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_NonPositiveInput_ThrowsNamingWafer()
    {
        ArrheniusPoint[] points = [Point("A", 1, 1, 873, 1000, 1), new ArrheniusPoint("BAD", 0, 1000, 880, 1), Point("C", 1, 1, 893, 900, 1)];
        var ex = Assert.Throws<ArgumentException>(() => ArrheniusCalibration.Fit(points));
        Assert.Contains("BAD", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Fit_TwoPoints_PassesThroughBothWithNaNIntervals()
    {
        // DERIVED: two points determine the line exactly; no residual degrees of freedom remain for an interval.
        ArrheniusFit fit = ArrheniusCalibration.Fit([Point("A", 1.3, 0.2, 850, 1800, 4), Point("B", 1.3, 0.2, 900, 1800, 4)]);
        Assert.Equal(1.3, fit.ActivationEnergy.Value, 9);
        Assert.Equal(0.2, fit.Prefactor.Value, 8);
        Assert.True(double.IsNaN(fit.ActivationEnergy.StandardError));
        Assert.False(fit.ActivationEnergy.IntervalContains(1.3));
    }
}
