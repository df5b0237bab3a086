namespace RunWatch.Backup;

/// <summary>One file of a backup: its path inside the data folder (with <c>/</c>), size in bytes and SHA-256 (hex).</summary>
internal sealed record BackupEntry(string Path, long Bytes, string Sha256);
