using RunWatch.Simulation.Chamber;
using Xunit;

namespace RunWatch.Simulation.Tests.Chamber;

public sealed class FirstOrderLagTests
{
    [Fact]
    public void Advance_StepInPower_FollowsOneMinusExpResponse()
    {
        // DERIVED: for τ·dT/dt = −(T − T_a) + K·u with a unit step in u, T(t) = T_a + K·(1 − e^{−t/τ}).
        var lag = new FirstOrderLag(timeConstantS: 40, gainKPerUnit: 1000, ambientC: 25, initialC: 25);
        for (int i = 1; i <= 3000; i++)
        {
            double t = i * 0.1;
            double actual = lag.Advance(power: 0.6, dtS: 0.1);
            double expected = 25 + 600 * (1 - Math.Exp(-t / 40));
            Assert.Equal(expected, actual, 1e-9);
        }
    }

    [Fact]
    public void Advance_StepSizeDoesNotMatter_ForConstantPower()
    {
        // DERIVED: the zero-order-hold solution is exact, so one 30 s step equals 300 steps of 0.1 s.
        var coarse = new FirstOrderLag(40, 1000, 25, 300);
        var fine = new FirstOrderLag(40, 1000, 25, 300);
        coarse.Advance(0.4, 30);
        for (int i = 0; i < 300; i++)
        {
            fine.Advance(0.4, 0.1);
        }
        Assert.Equal(coarse.TemperatureC, fine.TemperatureC, 1e-9);
    }
}
