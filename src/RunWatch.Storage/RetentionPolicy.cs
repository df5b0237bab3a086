namespace RunWatch.Storage;

/// <summary>What <see cref="IRunWatchStore.PruneAsync"/> removes.</summary>
/// <param name="SamplesBefore">Delete samples older than this.</param>
/// <param name="DeadLettersBefore">Delete dead letters older than this.</param>
/// <param name="NormalAlertsBefore">Delete alerts back to normal and last changed before this.</param>
/// <param name="MaxRowsPerStep">Delete at most this many rows per transaction, so writers are not held up.</param>
public sealed record RetentionPolicy(DateTimeOffset SamplesBefore, DateTimeOffset DeadLettersBefore, DateTimeOffset NormalAlertsBefore, int MaxRowsPerStep = 50_000);
