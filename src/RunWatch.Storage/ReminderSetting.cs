namespace RunWatch.Storage;

/// <summary>The editable part of one reminder rule as stored: its threshold and window.</summary>
/// <param name="RuleId">The rule's stable id.</param>
/// <param name="Threshold">Threshold in <paramref name="Unit"/>.</param>
/// <param name="Unit">Unit of the threshold, for example "°C".</param>
/// <param name="Window">Staleness limit or time after a run's end (zero when the rule has none).</param>
/// <param name="UpdatedAt">When it was last written.</param>
/// <param name="UpdatedBy">User name, or <c>configuration</c> for the seeded value.</param>
public sealed record ReminderSetting(string RuleId, double Threshold, string Unit, TimeSpan Window, DateTimeOffset UpdatedAt, string UpdatedBy);
