namespace RunWatch.Storage;

/// <summary>A chamber with the store's ids for it and its channels (same order as the definition).</summary>
/// <param name="ChamberId">Store id of the chamber.</param>
/// <param name="Definition">The definition it was registered with.</param>
/// <param name="Channels">Its channels with their ids.</param>
public sealed record RegisteredChamber(long ChamberId, ChamberDefinition Definition, IReadOnlyList<RegisteredChannel> Channels);
