namespace RunWatch.Storage;

/// <summary>A chamber and its channels as configured; registering it is idempotent.</summary>
/// <param name="Name">Chamber name as it appears in topics.</param>
/// <param name="Site">Site segment of the chamber's topics.</param>
/// <param name="Description">Free text, may be null.</param>
/// <param name="Channels">Its channels.</param>
public sealed record ChamberDefinition(string Name, string Site, string? Description, IReadOnlyList<ChannelDefinition> Channels);
