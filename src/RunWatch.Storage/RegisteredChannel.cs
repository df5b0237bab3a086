namespace RunWatch.Storage;

/// <summary>A channel with the store's ids.</summary>
/// <param name="ChamberId">Store id of the chamber.</param>
/// <param name="ChannelId">Store id of the channel, unique across chambers.</param>
/// <param name="Definition">The definition it was registered with.</param>
public sealed record RegisteredChannel(long ChamberId, long ChannelId, ChannelDefinition Definition);
