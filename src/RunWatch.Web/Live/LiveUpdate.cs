using RunWatch.Web.Data;

namespace RunWatch.Web.Live;

/// <summary>One piece of news for open pages.</summary>
/// <param name="Kind">What changed.</param>
/// <param name="Chamber">The chamber concerned.</param>
/// <param name="Samples">The committed samples, for <see cref="LiveUpdateKind.Samples"/>; otherwise empty.</param>
public sealed record LiveUpdate(LiveUpdateKind Kind, string Chamber, IReadOnlyList<LiveSample> Samples);
