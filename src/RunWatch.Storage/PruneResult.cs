namespace RunWatch.Storage;

/// <summary>Rows removed by <see cref="IRunWatchStore.PruneAsync"/>.</summary>
/// <param name="Samples">Samples removed.</param>
/// <param name="DeadLetters">Dead letters removed.</param>
/// <param name="Alerts">Alerts removed.</param>
public readonly record struct PruneResult(long Samples, long DeadLetters, long Alerts);
