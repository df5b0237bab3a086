using Xunit;
using MathNet.Numerics;
using RunWatch.Core.Thermal;

namespace RunWatch.Core.Tests.Thermal;

public sealed class ExponentialIntegralTests
{
    [Theory]
    // CONFIRMED to 8 digits: SciPy exp1 documentation; further digits COMPUTED HERE (CHECKS §8).
    [InlineData(1.0, 0.219383934395520)]
    [InlineData(2.0, 0.048900510708061)]
    [InlineData(10.0, 4.15696892968532e-6)]
    public void E1_PublishedValues_Match(double x, double expected)
    {
        Assert.Equal(expected, ExponentialIntegral.E1(x), expected * 1e-13);
    }

    [Fact]
    public void E1AndE2_AgainstMathNet_AgreeOverWideRange()
    {
        // Reference: MathNet.Numerics 5.0.0 SpecialFunctions.ExponentialIntegral(x, n) (A&S chapter 5).
        for (double x = 0.01; x <= 200; x *= 1.07)
        {
            double e1 = SpecialFunctions.ExponentialIntegral(x, 1);
            double e2 = SpecialFunctions.ExponentialIntegral(x, 2);
            Assert.True(Math.Abs(ExponentialIntegral.E1(x) / e1 - 1) < 1e-12, $"E1({x}) = {ExponentialIntegral.E1(x)} vs {e1}");
            Assert.True(Math.Abs(ExponentialIntegral.E2(x) / e2 - 1) < 1e-12, $"E2({x}) = {ExponentialIntegral.E2(x)} vs {e2}");
        }
    }

    [Fact]
    public void ScaledForms_AgainstMathNet_AgreeUpToLargeArguments()
    {
        // Reference: MathNet E_n(x)·eˣ; eˣ stays finite up to x ≈ 700.
        for (double x = 0.05; x <= 600; x *= 1.13)
        {
            double s1 = SpecialFunctions.ExponentialIntegral(x, 1) * Math.Exp(x);
            double s2 = SpecialFunctions.ExponentialIntegral(x, 2) * Math.Exp(x);
            Assert.True(Math.Abs(ExponentialIntegral.ScaledE1(x) / s1 - 1) < 1e-12, $"e^x E1({x})");
            Assert.True(Math.Abs(ExponentialIntegral.ScaledE2(x) / s2 - 1) < 1e-12, $"e^x E2({x})");
        }
    }

    [Fact]
    public void E2_RecurrenceWithE1_Holds()
    {
        // DERIVED: A&S 5.1.14, E2(x) = e^{−x} − x·E1(x).
        foreach (double x in new[] { 0.3, 1.0, 1.5, 7.0, 30.0 })
        {
            Assert.Equal(Math.Exp(-x) - x * ExponentialIntegral.E1(x), ExponentialIntegral.E2(x), Math.Exp(-x) * 1e-13);
        }
    }

    [Fact]
    public void Limits_AreHandled()
    {
        Assert.Equal(double.PositiveInfinity, ExponentialIntegral.E1(0));
        Assert.Equal(1.0, ExponentialIntegral.E2(0));
        Assert.True(double.IsNaN(ExponentialIntegral.E1(-1)));
        // DERIVED: eˣE2(x) → 1/x − 2/x² for large x (asymptotic series, A&S 5.1.51).
        Assert.Equal(1.0 / 1e6 - 2.0 / 1e12, ExponentialIntegral.ScaledE2(1e6), 1e-17);
    }
}
