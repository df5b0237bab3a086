namespace RunWatch.Core.Safety;

/// <summary>What the reminder rules say about one chamber: those that hold now, and those that cannot be judged.</summary>
/// <param name="Active">Reminders whose condition holds, in rule order.</param>
/// <param name="NotWatched">Reminders whose role has no channel on the chamber, or whose channel has no recent value, in rule order.</param>
public sealed record ReminderAssessment(IReadOnlyList<ActiveReminder> Active, IReadOnlyList<UnwatchedReminder> NotWatched);
