using System.Globalization;

namespace RunWatch.Core.Safety;

/// <summary>
/// Evaluates reminder rules against a chamber's live state. Pure: the same rules and state give the same result.
/// A rule reads the channel its role maps to on that chamber. A rule that cannot be judged - its role has no
/// channel, or the channel has no recent finite value - never holds and is reported as not watched, so that a
/// reminder that cannot fire says so instead of staying silent.
/// </summary>
public static class ReminderEvaluator
{
    /// <summary>Returns the reminders whose conditions hold, in rule order.</summary>
    public static IReadOnlyList<ActiveReminder> Evaluate(IReadOnlyList<ReminderRule> rules, LiveChamberState state) =>
        Assess(rules, state).Active;

    /// <summary>Returns the reminders that hold and those that are not watched on this chamber, in rule order.</summary>
    public static ReminderAssessment Assess(IReadOnlyList<ReminderRule> rules, LiveChamberState state)
    {
        ArgumentNullException.ThrowIfNull(rules);
        ArgumentNullException.ThrowIfNull(state);
        var active = new List<ActiveReminder>();
        var unwatched = new List<UnwatchedReminder>();
        foreach (var rule in rules)
        {
            if (rule.Kind != ReminderConditionKind.TelemetryStale && UnwatchedReason(rule, state) is { } why)
            {
                unwatched.Add(new UnwatchedReminder(rule, state.Chamber, why));
                continue;
            }
            string? reason = ReasonIfHolds(rule, state);
            if (reason is not null)
            {
                active.Add(new ActiveReminder(rule, state.Chamber, reason));
            }
        }
        return new ReminderAssessment(active, unwatched);
    }

    /// <summary>The channel a rule reads on this chamber, or null when its role is not mapped.</summary>
    public static string? ChannelFor(ReminderRule rule, LiveChamberState state)
    {
        ArgumentNullException.ThrowIfNull(rule);
        ArgumentNullException.ThrowIfNull(state);
        return rule.Role != ReminderChannelRole.None && state.RoleChannels is { } map && map.TryGetValue(rule.Role, out string? channel)
            && !string.IsNullOrWhiteSpace(channel)
            ? channel
            : null;
    }

    private static string? UnwatchedReason(ReminderRule rule, LiveChamberState state)
    {
        if (rule.Role == ReminderChannelRole.None)
        {
            return "the rule names no channel role";
        }
        string? channel = ChannelFor(rule, state);
        if (channel is null)
        {
            return $"no channel has the role {rule.Role} on this chamber";
        }
        if (!state.Values.TryGetValue(channel, out double value) || !double.IsFinite(value))
        {
            return $"channel {channel} ({rule.Role}) has no recent value";
        }
        if (state.ChannelStaleAfter > TimeSpan.Zero && state.ValueTimes is { } times && times.TryGetValue(channel, out DateTimeOffset at)
            && state.Now - at > state.ChannelStaleAfter)
        {
            return string.Create(CultureInfo.InvariantCulture,
                $"channel {channel} ({rule.Role}) last sampled {(state.Now - at).TotalSeconds:F0} s ago (limit {state.ChannelStaleAfter.TotalSeconds:F0} s)");
        }
        return null;
    }

    private static string? ReasonIfHolds(ReminderRule rule, LiveChamberState state)
    {
        switch (rule.Kind)
        {
            case ReminderConditionKind.TelemetryStale:
                if (state.LastSampleAt is null)
                {
                    return "no telemetry received yet";
                }
                var age = state.Now - state.LastSampleAt.Value;
                return age > rule.Window
                    ? string.Create(CultureInfo.InvariantCulture, $"last sample {age.TotalSeconds:F0} s ago (limit {rule.Window.TotalSeconds:F0} s)")
                    : null;
            case ReminderConditionKind.ChannelAbove:
                return TryValue(rule, state, out string channel, out double above) && above > rule.Threshold
                    ? Describe(rule, channel, above, "above")
                    : null;
            case ReminderConditionKind.ChannelBelow:
                return TryValue(rule, state, out channel, out double below) && below < rule.Threshold
                    ? Describe(rule, channel, below, "below")
                    : null;
            case ReminderConditionKind.ChannelOn:
                return TryValue(rule, state, out channel, out double on) && on >= 0.5
                    ? $"{channel} is on"
                    : null;
            case ReminderConditionKind.RunEndedAndChannelAbove:
                if (state.RunActive || state.LastRunEndedAt is null || state.Now - state.LastRunEndedAt.Value > rule.Window)
                {
                    return null;
                }
                if (!TryValue(rule, state, out channel, out double hot) || hot <= rule.Threshold)
                {
                    return null;
                }
                double minutes = (state.Now - state.LastRunEndedAt.Value).TotalMinutes;
                return string.Create(CultureInfo.InvariantCulture, $"run ended {minutes:F0} min ago; ") + Describe(rule, channel, hot, "above");
            default:
                throw new ArgumentOutOfRangeException(nameof(rule), rule.Kind, "Unknown reminder condition.");
        }
    }

    private static bool TryValue(ReminderRule rule, LiveChamberState state, out string channel, out double value)
    {
        value = double.NaN;
        channel = ChannelFor(rule, state) ?? "";
        return channel.Length > 0 && state.Values.TryGetValue(channel, out value) && double.IsFinite(value);
    }

    private static string Describe(ReminderRule rule, string channel, double value, string relation) =>
        string.Create(CultureInfo.InvariantCulture, $"{channel} {value:F1} {rule.Unit} {relation} {rule.Threshold:G} {rule.Unit}");
}
