using RunWatch.Simulation.Chamber;
using Xunit;

namespace RunWatch.Simulation.Tests.Chamber;

public sealed class PidControllerTests
{
    [Fact]
    public void Update_ClosedLoopOnFirstOrderLag_SettlesWithoutOffset()
    {
        // DERIVED: with integral action the steady-state error of a constant setpoint is zero.
        var plant = new FirstOrderLag(40, 1000, 25, 200);
        var pid = new PidController(0.004, 0.0001, 0);
        for (int i = 0; i < 6000; i++)
        {
            plant.Advance(pid.Update(610, plant.TemperatureC, 0.1), 0.1);
        }
        Assert.Equal(610, plant.TemperatureC, 1e-3);
        Assert.Equal((610 - 25) / 1000.0, pid.Output, 1e-5);
    }

    [Fact]
    public void Update_LargeError_ClampsOutputAndDoesNotWindUp()
    {
        var pid = new PidController(0.004, 0.0001, 0);
        for (int i = 0; i < 10_000; i++)
        {
            Assert.InRange(pid.Update(1000, 25, 0.1), 0, 1);
        }
        Assert.Equal(1, pid.Output);
        // Without windup the output leaves saturation as soon as the error changes sign.
        Assert.True(pid.Update(600, 605, 0.1) < 1);
    }
}
