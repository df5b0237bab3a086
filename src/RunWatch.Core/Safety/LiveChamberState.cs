namespace RunWatch.Core.Safety;

/// <summary>The latest known state of one chamber, the input to <see cref="ReminderEvaluator"/>.</summary>
/// <param name="Chamber">Chamber name.</param>
/// <param name="Now">Evaluation time.</param>
/// <param name="LastSampleAt">Time of the latest sample on any channel, or null if none has arrived.</param>
/// <param name="Values">Latest value per channel name, in the channel's configured unit.</param>
/// <param name="RunActive">Whether a run is in progress.</param>
/// <param name="LastRunEndedAt">When the latest run ended, or null.</param>
/// <param name="RoleChannels">The chamber's channel for each reminder role it maps; a role missing here is not watched.</param>
/// <param name="ValueTimes">When each value in <paramref name="Values"/> was sampled; a channel without a time is judged by its value alone.</param>
/// <param name="ChannelStaleAfter">A mapped channel whose latest sample is older than this is not watched (zero: never).</param>
public sealed record LiveChamberState(
    string Chamber,
    DateTimeOffset Now,
    DateTimeOffset? LastSampleAt,
    IReadOnlyDictionary<string, double> Values,
    bool RunActive,
    DateTimeOffset? LastRunEndedAt,
    IReadOnlyDictionary<ReminderChannelRole, string>? RoleChannels = null,
    IReadOnlyDictionary<string, DateTimeOffset>? ValueTimes = null,
    TimeSpan ChannelStaleAfter = default);
