namespace RunWatch.Simulation.Chamber;

/// <summary>
/// A discrete PID controller with output clamped to [0, 1] and conditional integration (the integral stops growing
/// while the output is saturated in the same direction), the usual anti-windup for heater control.
/// </summary>
internal sealed class PidController(double proportionalPerK, double integralPerKS, double derivativeSPerK)
{
    private double _integral;
    private double _previousError = double.NaN;

    /// <summary>Last output, 0…1.</summary>
    public double Output { get; private set; }

    /// <summary>One control step: error = setpoint − measurement.</summary>
    public double Update(double setpointC, double measurementC, double dtS)
    {
        double error = setpointC - measurementC;
        double derivative = double.IsNaN(_previousError) ? 0 : (error - _previousError) / dtS;
        _previousError = error;
        double candidateIntegral = _integral + error * dtS;
        double raw = proportionalPerK * error + integralPerKS * candidateIntegral + derivativeSPerK * derivative;
        bool saturatedHigh = raw > 1 && error > 0;
        bool saturatedLow = raw < 0 && error < 0;
        if (!saturatedHigh && !saturatedLow)
        {
            _integral = candidateIntegral;
        }
        raw = proportionalPerK * error + integralPerKS * _integral + derivativeSPerK * derivative;
        Output = Math.Clamp(raw, 0, 1);
        return Output;
    }
}
