using System.Globalization;

namespace RunWatch.Core.Safety;

/// <summary>
/// Evaluates reminder rules against a chamber's live state. Pure: the same rules and state give the same result.
/// A channel with no value never makes its rule hold; staleness is reported by its own rule.
/// </summary>
public static class ReminderEvaluator
{
    /// <summary>Returns the reminders whose conditions hold, in rule order.</summary>
    public static IReadOnlyList<ActiveReminder> Evaluate(IReadOnlyList<ReminderRule> rules, LiveChamberState state)
    {
        ArgumentNullException.ThrowIfNull(rules);
        ArgumentNullException.ThrowIfNull(state);
        var active = new List<ActiveReminder>();
        foreach (var rule in rules)
        {
            string? reason = ReasonIfHolds(rule, state);
            if (reason is not null)
            {
                active.Add(new ActiveReminder(rule, state.Chamber, reason));
            }
        }
        return active;
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
                return TryValue(rule, state, out double above) && above > rule.Threshold
                    ? Describe(rule, above, "above")
                    : null;
            case ReminderConditionKind.ChannelBelow:
                return TryValue(rule, state, out double below) && below < rule.Threshold
                    ? Describe(rule, below, "below")
                    : null;
            case ReminderConditionKind.ChannelOn:
                return TryValue(rule, state, out double on) && on >= 0.5
                    ? $"{rule.Channel} is on"
                    : null;
            case ReminderConditionKind.RunEndedAndChannelAbove:
                if (state.RunActive || state.LastRunEndedAt is null || state.Now - state.LastRunEndedAt.Value > rule.Window)
                {
                    return null;
                }
                if (!TryValue(rule, state, out double hot) || hot <= rule.Threshold)
                {
                    return null;
                }
                double minutes = (state.Now - state.LastRunEndedAt.Value).TotalMinutes;
                return string.Create(CultureInfo.InvariantCulture, $"run ended {minutes:F0} min ago; ") + Describe(rule, hot, "above");
            default:
                throw new ArgumentOutOfRangeException(nameof(rule), rule.Kind, "Unknown reminder condition.");
        }
    }

    private static bool TryValue(ReminderRule rule, LiveChamberState state, out double value)
    {
        value = double.NaN;
        return rule.Channel is not null && state.Values.TryGetValue(rule.Channel, out value) && double.IsFinite(value);
    }

    private static string Describe(ReminderRule rule, double value, string relation) =>
        string.Create(CultureInfo.InvariantCulture, $"{rule.Channel} {value:F1} {rule.Unit} {relation} {rule.Threshold:G} {rule.Unit}");
}
