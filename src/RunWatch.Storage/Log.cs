using Microsoft.Extensions.Logging;

namespace RunWatch.Storage;

/// <summary>Log messages of the store (event ids 1000–1099).</summary>
internal static partial class Log
{
    [LoggerMessage(EventId = 1000, Level = LogLevel.Information, Message = "SQLite store at {DatabasePath}: {MigrationsApplied} migration(s) applied, schema version {SchemaVersion}")]
    public static partial void StoreOpened(ILogger logger, string databasePath, int migrationsApplied, int schemaVersion);

    [LoggerMessage(EventId = 1001, Level = LogLevel.Warning, Message = "SQLite write failed (code {SqliteErrorCode}); the writer connection will be reopened")]
    public static partial void WriteFailed(ILogger logger, int sqliteErrorCode, Exception exception);

    [LoggerMessage(EventId = 1002, Level = LogLevel.Debug, Message = "WAL checkpoint after {IdleMs} ms idle: {LogFrames} frames, {CheckpointedFrames} checkpointed")]
    public static partial void Checkpointed(ILogger logger, long idleMs, int logFrames, int checkpointedFrames);

    [LoggerMessage(EventId = 1003, Level = LogLevel.Information, Message = "Pruned {Samples} samples, {DeadLetters} dead letters, {Alerts} alerts")]
    public static partial void Pruned(ILogger logger, long samples, long deadLetters, long alerts);
}
