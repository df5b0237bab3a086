namespace RunWatch.Storage;

/// <summary>
/// An admin's choice of the channel a reminder role reads on one chamber, in place of the channel configured with
/// that role. <paramref name="Channel"/> null means "no channel": the role's reminders are then not watched there.
/// </summary>
/// <param name="Chamber">Chamber name.</param>
/// <param name="Role">Role name (a <see cref="ChannelRole"/> name other than Other, Setpoint and GrowthShutter).</param>
/// <param name="Channel">The chamber's channel, or null for none.</param>
/// <param name="UpdatedAt">When it was set.</param>
/// <param name="UpdatedBy">Who set it.</param>
public sealed record ReminderBinding(string Chamber, string Role, string? Channel, DateTimeOffset UpdatedAt, string UpdatedBy);
