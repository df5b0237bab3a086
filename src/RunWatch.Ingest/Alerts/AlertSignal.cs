using RunWatch.Core.Excursions;

namespace RunWatch.Ingest.Alerts;

/// <summary>An alarm changed state (from a chamber's Core monitor, or a daemon-wide condition).</summary>
/// <param name="Key">Identity of the condition, e.g. <c>C1/deviation-alarm</c>.</param>
/// <param name="Chamber">Chamber name, null for daemon-wide.</param>
/// <param name="Site">Site of the chamber, null for daemon-wide.</param>
/// <param name="Kind">Kind code.</param>
/// <param name="To">New state.</param>
/// <param name="At">When.</param>
/// <param name="Value">The last reading (°C) or NaN.</param>
/// <param name="Message">One line for people.</param>
/// <param name="Replayed">
/// From samples already stored, replayed at a takeover in fleet mode (<see cref="AlertEngine.Replay"/>): applied only
/// where the store does not already hold the change.
/// </param>
internal sealed record AlertSignal(string Key, string? Chamber, string? Site, string Kind, AlarmState To, DateTimeOffset At, double Value, string Message, bool Replayed = false);
