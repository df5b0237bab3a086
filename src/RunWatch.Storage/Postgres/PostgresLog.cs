using Microsoft.Extensions.Logging;

namespace RunWatch.Storage.Postgres;

/// <summary>Log messages of the PostgreSQL store (event ids 1100–1149). Never the connection string: it may hold a password.</summary>
internal static partial class PostgresLog
{
    [LoggerMessage(EventId = 1100, Level = LogLevel.Information, Message = "PostgreSQL store {Host}:{Port}/{Database}: {MigrationsApplied} migration(s) applied, schema version {SchemaVersion}")]
    public static partial void StoreOpened(ILogger logger, string? host, int port, string? database, int migrationsApplied, int schemaVersion);

    [LoggerMessage(EventId = 1101, Level = LogLevel.Warning, Message = "PostgreSQL write failed ({SqlState}); the ingest connection will be reopened")]
    public static partial void WriteFailed(ILogger logger, string sqlState, Exception exception);

    [LoggerMessage(EventId = 1102, Level = LogLevel.Information, Message = "Pruned {Samples} samples, {DeadLetters} dead letters, {Alerts} alerts")]
    public static partial void Pruned(ILogger logger, long samples, long deadLetters, long alerts);

    [LoggerMessage(EventId = 1103, Level = LogLevel.Warning, Message = "PostgreSQL commit listener lost its connection; listening again shortly")]
    public static partial void ListenerFailed(ILogger logger, Exception exception);

    [LoggerMessage(EventId = 1104, Level = LogLevel.Warning, Message = "Unreadable commit notification ignored ({Length} characters)")]
    public static partial void NotificationUnreadable(ILogger logger, int length);
}
