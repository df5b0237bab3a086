namespace RunWatch.Core.Safety;

/// <summary>A reminder that cannot fire on a chamber now, with the reason in words (shown as "not watched on this chamber").</summary>
/// <param name="Rule">The rule.</param>
/// <param name="Chamber">The chamber.</param>
/// <param name="Reason">Why, for example "no channel has the role ArsenicSourceTemperature".</param>
public sealed record UnwatchedReminder(ReminderRule Rule, string Chamber, string Reason);
