using RunWatch.Core.Profiles;
using Xunit;

namespace RunWatch.Core.Tests.Profiles;

public sealed class BlurredEdgeFitTests
{
    /// <summary>
    /// Truth by direct numerical convolution (midpoint rule, 0.001 px) of the unblurred profile with a Gaussian, not by
    /// the closed form the fit uses: a step of height A at δ (inside at u &lt; δ) plus a rim B·exp(−(δ−v)/w) inside.
    /// </summary>
    private static double Convolved(double u, double delta, double sigma, double a, double b, double w)
    {
        const double dv = 0.001;
        double sum = 0;
        for (double v = u - (8 * sigma); v < u + (8 * sigma); v += dv)
        {
            double m = v + (dv / 2);
            double sharp = m < delta ? a + (b * Math.Exp(-(delta - m) / w)) : 0;
            sum += sharp * Math.Exp(-((u - m) * (u - m)) / (2 * sigma * sigma)) * dv;
        }
        return sum / (sigma * Math.Sqrt(2 * Math.PI));
    }

    [Theory]
    [InlineData(0.13, 0.8, 1.0, 0.0, 1.0)]
    [InlineData(-0.27, 1.2, 1.0, 0.5, 1.5)]
    [InlineData(0.31, 0.9, 1.0, 0.8, 0.8)]
    [InlineData(0.05, 1.5, 1.0, 0.4, 3.0)]
    public void Fit_NumericallyBlurredEdge_RecoversEdgeAndBlur(double delta, double sigma, double a, double b, double w)
    {
        double[] u = Enumerable.Range(0, 25).Select(i => (i - 12) * 0.25).ToArray();
        double[] y = u.Select(x => Convolved(x, delta, sigma, a, b, w)).ToArray();
        BlurredEdge fit = BlurredEdgeFit.Fit(u, y);
        Assert.InRange(fit.Offset, delta - 0.02, delta + 0.02);
        Assert.InRange(fit.Sigma, sigma * 0.97, sigma * 1.03);
        Assert.True(fit.Rms < 2e-3, $"rms {fit.Rms}");
    }

    [Fact]
    public void Fit_PlainStep_HalfMaximumIsTheEdge()
    {
        // DERIVED: for A·Φ(−(u−δ)/σ) the value at u = δ is A/2, so the fitted δ is the half-maximum crossing.
        double[] u = Enumerable.Range(0, 25).Select(i => (i - 12) * 0.25).ToArray();
        double[] y = u.Select(x => Convolved(x, 0.2, 1.0, 2.0, 0, 1)).ToArray();
        BlurredEdge fit = BlurredEdgeFit.Fit(u, y);
        Assert.Equal(1.0, BlurredEdgeFit.Value(fit with { RimHeight = 0 }, fit.Offset) / fit.StepHeight * 2, 3);
        Assert.InRange(fit.Offset, 0.18, 0.22);
    }
}
