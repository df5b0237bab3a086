namespace RunWatch.Reports.Model;

/// <summary>One temperature excursion in the thermal record.</summary>
/// <param name="StartS">Start, seconds after run start.</param>
/// <param name="EndS">End, seconds after run start.</param>
/// <param name="PeakTemperatureC">Most extreme temperature reached (°C).</param>
/// <param name="PeakDeviationK">Peak deviation from the setpoint (K; signed).</param>
/// <param name="RelativeLChange">The excursion's effect on the diffusion length, ΔL/L (fraction; signed).</param>
/// <param name="Description">Short description (for example "over-temperature").</param>
public sealed record ExcursionRow(double StartS, double EndS, double PeakTemperatureC, double PeakDeviationK, double RelativeLChange, string Description);
