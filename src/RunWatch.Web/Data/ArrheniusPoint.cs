namespace RunWatch.Web.Data;

/// <summary>One diffusivity estimate at a temperature.</summary>
public sealed record ArrheniusPoint(double TemperatureK, double DiffusivityCmSquaredPerSecond);
