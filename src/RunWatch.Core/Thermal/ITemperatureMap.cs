namespace RunWatch.Core.Thermal;

/// <summary>Reading in °C to true temperature in K, as a struct so the integrator's loop is specialised and inlined.</summary>
internal interface ITemperatureMap
{
    double ToKelvin(double readingC);
}
