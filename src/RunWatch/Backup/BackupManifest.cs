namespace RunWatch.Backup;

/// <summary>What a backup archive holds: every file with its size and SHA-256.</summary>
internal sealed record BackupManifest(string Format, DateTimeOffset CreatedAt, string Database, IReadOnlyList<BackupEntry> Files);
