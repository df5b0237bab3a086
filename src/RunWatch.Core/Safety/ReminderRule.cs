namespace RunWatch.Core.Safety;

/// <summary>One configurable reminder: a condition on live state and the words shown while it holds.</summary>
/// <param name="Id">Stable identifier (used in the audit log).</param>
/// <param name="Title">Short heading, for example "Substrate above venting limit".</param>
/// <param name="Message">What to keep in mind while the condition holds.</param>
/// <param name="Hazard">Hazard class, shown as a label.</param>
/// <param name="Kind">The condition tested.</param>
/// <param name="Role">The channel role read by channel conditions (each chamber maps it to one of its channels); <see cref="ReminderChannelRole.None"/> for <see cref="ReminderConditionKind.TelemetryStale"/>.</param>
/// <param name="Threshold">Threshold in <paramref name="Unit"/> for above/below conditions.</param>
/// <param name="Unit">Unit of the channel and threshold, for example "°C".</param>
/// <param name="Window">Staleness limit, or how long after a run's end the rule applies.</param>
public sealed record ReminderRule(
    string Id,
    string Title,
    string Message,
    HazardKind Hazard,
    ReminderConditionKind Kind,
    ReminderChannelRole Role = ReminderChannelRole.None,
    double Threshold = 0,
    string Unit = "",
    TimeSpan Window = default);
