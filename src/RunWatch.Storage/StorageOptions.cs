using System.ComponentModel.DataAnnotations;

namespace RunWatch.Storage;

/// <summary>Options of the store, bound from the <c>Storage</c> section.</summary>
public sealed class StorageOptions
{
    /// <summary>Configuration section name.</summary>
    public const string SectionName = "Storage";

    /// <summary>Store provider: <c>Sqlite</c> (one box) or <c>PostgreSql</c> (a fleet of daemons sharing one database). <value>Default <c>Sqlite</c>.</value></summary>
    [Required]
    [RegularExpression("^(?i:Sqlite|PostgreSql)$", ErrorMessage = "Storage:Provider must be Sqlite or PostgreSql")]
    public string Provider { get; set; } = "Sqlite";

    /// <summary>Folder for the database and other data, relative to the working directory unless absolute. <value>Default <c>data</c>.</value></summary>
    [Required]
    public string DataDirectory { get; set; } = "data";

    /// <summary>SQLite database file name inside <see cref="DataDirectory"/>. <value>Default <c>runwatch.db</c>.</value></summary>
    [Required]
    public string DatabaseFile { get; set; } = "runwatch.db";

    /// <summary>
    /// SQLite <c>synchronous</c> mode: <c>Full</c> makes every commit survive power loss before it is acknowledged to the
    /// broker; <c>Normal</c> survives a process crash only. <value>Default <c>Full</c>.</value>
    /// </summary>
    [RegularExpression("^(Full|Normal)$")]
    public string Synchronous { get; set; } = "Full";

    /// <summary>Size the WAL file is truncated to after checkpoints, bytes. <value>Default 64 MiB.</value></summary>
    [Range(0, long.MaxValue)]
    public long JournalSizeLimitBytes { get; set; } = 64L * 1024 * 1024;

    /// <summary>How long a write waits for a lock held by another process before failing. <value>Default 5 s.</value></summary>
    public TimeSpan BusyTimeout { get; set; } = TimeSpan.FromSeconds(5);

    /// <summary>Ingest idle time after which <see cref="IRunWatchStore.MaintainAsync"/> checkpoints the WAL. <value>Default 2 s.</value></summary>
    public TimeSpan IdleCheckpointAfter { get; set; } = TimeSpan.FromSeconds(2);

    /// <summary>Most dead letters kept; older ones are deleted as new ones arrive. <value>Default 10 000.</value></summary>
    [Range(1, int.MaxValue)]
    public int DeadLetterLimit { get; set; } = 10_000;

    /// <summary>Payload bytes kept per dead letter. <value>Default 4096.</value></summary>
    [Range(0, 1_048_576)]
    public int DeadLetterPayloadBytes { get; set; } = 4096;

    /// <summary>
    /// Npgsql connection string of the PostgreSQL store (only with <c>Provider=PostgreSql</c>). Keep the password out of
    /// configuration files: Npgsql reads <c>PGPASSWORD</c> or a <c>~/.pgpass</c> file when the string has none.
    /// </summary>
    public string? ConnectionString { get; set; }

    /// <summary>How the PostgreSQL store writes sample batches. <value>Default <c>UnnestArrays</c> (measured fastest, docs/fleet.md).</value></summary>
    public Postgres.PostgresSampleWrite PostgresSampleWrite { get; set; } = Postgres.PostgresSampleWrite.UnnestArrays;

    /// <summary>True when <see cref="Provider"/> selects PostgreSQL.</summary>
    public bool UsesPostgres => string.Equals(Provider, "PostgreSql", StringComparison.OrdinalIgnoreCase);

    /// <summary>Full path of the SQLite file from the two path options.</summary>
    public string DatabasePath => Path.GetFullPath(Path.Combine(DataDirectory, DatabaseFile));
}
