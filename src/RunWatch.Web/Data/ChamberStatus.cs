namespace RunWatch.Web.Data;

/// <summary>One chamber as the overview shows it.</summary>
public sealed record ChamberStatus(string Chamber, string Site, double? Temperature, double? Setpoint, string TemperatureChannel, string SetpointChannel, string TemperatureUnit, DateTimeOffset? LastSampleAt, RunSummary? ActiveRun, DateTimeOffset? LastRunEndedAt, int OpenAlerts, IReadOnlyDictionary<string, double> LatestValues, TemperatureBands Bands);
