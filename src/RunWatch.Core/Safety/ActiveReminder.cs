namespace RunWatch.Core.Safety;

/// <summary>A reminder whose condition holds now, with the reading that made it hold.</summary>
/// <param name="Rule">The rule.</param>
/// <param name="Chamber">The chamber it applies to.</param>
/// <param name="Reason">Why it holds, in words with units, for example "substrate_tc 412.0 °C above 300 °C".</param>
public sealed record ActiveReminder(ReminderRule Rule, string Chamber, string Reason);
