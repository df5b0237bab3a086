namespace RunWatch.Storage;

/// <summary>Samples of one channel that another instance committed, as a commit listener delivers them.</summary>
/// <param name="Chamber">Chamber name.</param>
/// <param name="Channel">Channel name.</param>
/// <param name="Samples">The stored samples of the committed range, in time order.</param>
public sealed record CommittedSamples(string Chamber, string Channel, IReadOnlyList<SampleRecord> Samples);
