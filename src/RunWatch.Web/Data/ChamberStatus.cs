using RunWatch.Core.Safety;

namespace RunWatch.Web.Data;

/// <summary>One chamber as the overview shows it.</summary>
/// <remarks>
/// The last three members are optional: LatestTimes (when each latest value was sampled), ConfiguredRoles (the
/// chamber's channel per reminder role, from its channel configuration) and Channels (every channel it has).
/// </remarks>
public sealed record ChamberStatus(string Chamber, string Site, double? Temperature, double? Setpoint, string TemperatureChannel, string SetpointChannel, string TemperatureUnit, DateTimeOffset? LastSampleAt, RunSummary? ActiveRun, DateTimeOffset? LastRunEndedAt, int OpenAlerts, IReadOnlyDictionary<string, double> LatestValues, TemperatureBands Bands,
    IReadOnlyDictionary<string, DateTimeOffset>? LatestTimes = null, IReadOnlyDictionary<ReminderChannelRole, string>? ConfiguredRoles = null,
    IReadOnlyList<string>? Channels = null);
