namespace RunWatch.Core.Safety;

/// <summary>What a reminder rule tests on a chamber's live state.</summary>
public enum ReminderConditionKind
{
    /// <summary>The channel's latest value is above the threshold.</summary>
    ChannelAbove,

    /// <summary>The channel's latest value is below the threshold.</summary>
    ChannelBelow,

    /// <summary>The channel is on (value ≥ 0.5), for shutters, valves and fill flags.</summary>
    ChannelOn,

    /// <summary>No sample has arrived for longer than the rule's window.</summary>
    TelemetryStale,

    /// <summary>A run ended within the rule's window and the channel is still above the threshold.</summary>
    RunEndedAndChannelAbove,
}
