namespace RunWatch.Web.Data;

/// <summary>A point of a planned temperature profile.</summary>
public sealed record ProfilePoint(double Minutes, double TemperatureC);
