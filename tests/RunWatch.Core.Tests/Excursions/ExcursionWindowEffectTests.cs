using RunWatch.Core.Excursions;
using RunWatch.Core.Thermal;
using Xunit;

namespace RunWatch.Core.Tests.Excursions;

public sealed class ExcursionWindowEffectTests
{
    // Invented process: D0 = 1e-2 cm²/s, Ea = 1.3 eV; setpoint 600 °C, excursion at 612 °C.
    private static readonly ArrheniusDiffusivity Process = new(1e-2, 1.3);

    /// <summary>
    /// DERIVED (closed form): for a temperature held constant at T1 against a setpoint held at T0 over τ seconds,
    /// ∫(D(T1) − D(T0)) dt = D0·τ·(exp(−Ea/kB·T1) − exp(−Ea/kB·T0)).
    /// </summary>
    private static double ClosedForm(double seconds, double actualC, double setpointC)
    {
        double a = Process.ActivationTemperatureK;
        return Process.D0CmSqPerS * seconds * (Math.Exp(-a / (actualC + 273.15)) - Math.Exp(-a / (setpointC + 273.15)));
    }

    /// <summary>600 °C from 0 to 100 s, 612 °C from 100 to 200 s (a 1 ms step), 600 °C to 300 s, a sample each second.</summary>
    private static (double[] Times, double[] Temperatures, double[] Setpoints) Profile()
    {
        var times = new List<double>();
        var temperatures = new List<double>();
        for (int s = 0; s <= 300; s++)
        {
            times.Add(s);
            temperatures.Add(s is > 100 and < 200 ? 612 : 600);
            if (s is 100)
            {
                times.Add(100.001);
                temperatures.Add(612);
            }
            if (s is 199)
            {
                times.Add(199.999);
                temperatures.Add(612);
            }
        }
        var setpoints = Enumerable.Repeat(600.0, times.Count).ToArray();
        return (times.ToArray(), temperatures.ToArray(), setpoints);
    }

    [Fact]
    public void ExcessIntegralCmSq_ExcursionInsideWindow_EqualsClosedFormOfTheHeldTemperature()
    {
        var (t, temperatures, setpoints) = Profile();

        double excess = ExcursionWindowEffect.ExcessIntegralCmSq(t, temperatures, setpoints, 100.001, 199.999, 0, 300, Process, 10);

        Assert.Equal(ClosedForm(99.998, 612, 600), excess, ClosedForm(99.998, 612, 600) * 1e-9);
    }

    [Fact]
    public void ExcessIntegralCmSq_ExcursionBeforeWindow_IsZero()
    {
        var (t, temperatures, setpoints) = Profile();

        Assert.Equal(0, ExcursionWindowEffect.ExcessIntegralCmSq(t, temperatures, setpoints, 100.001, 199.999, 250, 300, Process, 10));
    }

    [Fact]
    public void ExcessIntegralCmSq_WindowStartsMidExcursion_CountsOnlyTheOverlap()
    {
        // The window opens at 150.5 s, inside a one-second segment at 612 °C: the cut is interpolated.
        var (t, temperatures, setpoints) = Profile();

        double excess = ExcursionWindowEffect.ExcessIntegralCmSq(t, temperatures, setpoints, 100.001, 199.999, 150.5, 300, Process, 10);

        Assert.Equal(ClosedForm(199.999 - 150.5, 612, 600), excess, ClosedForm(49.499, 612, 600) * 1e-9);
    }

    [Fact]
    public void ExcessIntegralCmSq_GapLongerThanLimit_LeftOut()
    {
        // Samples at 0, 50, 100 s only, all at 612 °C against 600 °C; with a 10 s gap limit nothing is integrated.
        double[] t = [0, 50, 100];
        double[] temperatures = [612, 612, 612];
        double[] setpoints = [600, 600, 600];

        Assert.Equal(0, ExcursionWindowEffect.ExcessIntegralCmSq(t, temperatures, setpoints, 0, 100, 0, 100, Process, 10));
        Assert.Equal(ClosedForm(100, 612, 600), ExcursionWindowEffect.ExcessIntegralCmSq(t, temperatures, setpoints, 0, 100, 0, 100, Process, 60),
            ClosedForm(100, 612, 600) * 1e-9);
    }
}
