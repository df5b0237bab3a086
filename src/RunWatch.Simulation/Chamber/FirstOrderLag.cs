namespace RunWatch.Simulation.Chamber;

/// <summary>
/// A first-order thermal lag, τ·dT/dt = −(T − T_ambient) + gain·u, with heater power u held constant over each step
/// (zero-order hold), advanced by the exact solution T(t+Δt) = T∞ + (T − T∞)·e^{−Δt/τ}, T∞ = T_ambient + gain·u.
/// </summary>
internal sealed class FirstOrderLag(double timeConstantS, double gainKPerUnit, double ambientC, double initialC)
{
    /// <summary>Time constant τ in s.</summary>
    public double TimeConstantS { get; } = timeConstantS;

    /// <summary>Steady-state rise per unit of heater power, K.</summary>
    public double GainKPerUnit { get; } = gainKPerUnit;

    /// <summary>Ambient (heater off) temperature, °C.</summary>
    public double AmbientC { get; } = ambientC;

    /// <summary>Current temperature, °C.</summary>
    public double TemperatureC { get; private set; } = initialC;

    /// <summary>Advances by <paramref name="dtS"/> with heater power <paramref name="power"/> plus an extra heat input in K of steady-state rise.</summary>
    public double Advance(double power, double dtS, double disturbanceK = 0)
    {
        double target = AmbientC + GainKPerUnit * power + disturbanceK;
        TemperatureC = target + (TemperatureC - target) * Math.Exp(-dtS / TimeConstantS);
        return TemperatureC;
    }
}
