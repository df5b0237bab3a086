namespace RunWatch.Storage.Postgres;

/// <summary>Who holds a chamber's ownership lock right now, as the server sees it.</summary>
/// <param name="ChamberId">Store id of the chamber.</param>
/// <param name="Instance">The holder's instance name (from its session's application name).</param>
/// <param name="Since">When the holder's session started (the lock is at most this old).</param>
public sealed record ChamberOwner(long ChamberId, string Instance, DateTimeOffset Since);
