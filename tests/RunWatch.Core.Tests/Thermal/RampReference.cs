using MathNet.Numerics;

namespace RunWatch.Core.Tests.Thermal;

/// <summary>
/// Reference for ∫ exp(−a/T(t)) dt with T = T0 + β·t, from the closed form
/// (1/β)·[F(T0+β·t) − F(T0)], F(T) = T·e^{−a/T} − a·E1(a/T) (DERIVED, CHECKS §8), with E1 from MathNet.Numerics.
/// </summary>
internal static class RampReference
{
    public static double F(double temperatureK, double activationK)
    {
        double x = activationK / temperatureK;
        return temperatureK * Math.Exp(-x) - activationK * SpecialFunctions.ExponentialIntegral(x, 1);
    }

    public static double Integral(double startK, double rateKPerS, double durationS, double activationK) =>
        (F(startK + rateKPerS * durationS, activationK) - F(startK, activationK)) / rateKPerS;
}
