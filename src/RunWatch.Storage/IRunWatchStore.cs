namespace RunWatch.Storage;

/// <summary>
/// The RunWatch store: chambers and channels, telemetry samples, events, runs, alerts, dead letters and audit
/// entries. SQLite implements it today (<c>SqliteRunWatchStore</c>); a PostgreSQL implementation will satisfy the
/// same contract. Implementations are thread-safe; writes are serialised internally. A write that fails throws
/// <see cref="StoreUnavailableException"/> and keeps nothing of that write.
/// </summary>
public interface IRunWatchStore
{
    /// <summary>Creates or upgrades the schema to the newest migration. Idempotent.</summary>
    /// <returns>Number of migrations applied now (0 when already current).</returns>
    Task<int> MigrateAsync(CancellationToken cancellationToken);

    /// <summary>Registers chambers and their channels (insert or update by name) and returns their ids.</summary>
    Task<IReadOnlyList<RegisteredChamber>> RegisterChambersAsync(IReadOnlyList<ChamberDefinition> chambers, CancellationToken cancellationToken);

    /// <summary>All registered chambers with their channels.</summary>
    Task<IReadOnlyList<RegisteredChamber>> ListChambersAsync(CancellationToken cancellationToken);

    /// <summary>
    /// Writes the batch's samples, events and dead letters in one transaction. Samples and events already stored
    /// are ignored (idempotent); <see cref="IngestBatch.Inserted"/> tells which samples were new. The dead-letter
    /// table is trimmed to its bound in the same transaction.
    /// </summary>
    Task<BatchWriteResult> WriteBatchAsync(IngestBatch batch, CancellationToken cancellationToken);

    /// <summary>Samples of one channel with <paramref name="from"/> ≤ t &lt; <paramref name="to"/>, oldest first, at most <paramref name="maxCount"/>.</summary>
    /// <exception cref="KeyNotFoundException">The chamber or channel is not registered.</exception>
    Task<IReadOnlyList<SampleRecord>> GetSamplesAsync(string chamber, string channel, DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken);

    /// <summary>Events of one chamber with <paramref name="from"/> ≤ t &lt; <paramref name="to"/>, oldest first.</summary>
    Task<IReadOnlyList<EventRecord>> GetEventsAsync(string chamber, DateTimeOffset from, DateTimeOffset to, CancellationToken cancellationToken);

    /// <summary>Inserts (when <see cref="RunRecord.Id"/> is 0) or updates a run; returns it with its id.</summary>
    Task<RunRecord> SaveRunAsync(RunRecord run, CancellationToken cancellationToken);

    /// <summary>A run by id, or null.</summary>
    Task<RunRecord?> GetRunAsync(long id, CancellationToken cancellationToken);

    /// <summary>Runs, newest start first; optionally of one chamber and started before <paramref name="startedBefore"/> (for paging).</summary>
    Task<IReadOnlyList<RunRecord>> ListRunsAsync(string? chamber, DateTimeOffset? startedBefore, int maxCount, CancellationToken cancellationToken);

    /// <summary>Runs still open (for resuming tracking after a restart).</summary>
    Task<IReadOnlyList<RunRecord>> GetOpenRunsAsync(CancellationToken cancellationToken);

    /// <summary>Inserts (when <see cref="AlertRecord.Id"/> is 0) or updates an alert; returns it with its id.</summary>
    Task<AlertRecord> SaveAlertAsync(AlertRecord alert, CancellationToken cancellationToken);

    /// <summary>An alert by id, or null.</summary>
    Task<AlertRecord?> GetAlertAsync(long id, CancellationToken cancellationToken);

    /// <summary>Alerts not in <see cref="AlertState.Normal"/>, newest first.</summary>
    Task<IReadOnlyList<AlertRecord>> GetActiveAlertsAsync(CancellationToken cancellationToken);

    /// <summary>Alerts raised in [<paramref name="from"/>, <paramref name="to"/>), newest first, at most <paramref name="maxCount"/>.</summary>
    Task<IReadOnlyList<AlertRecord>> GetAlertHistoryAsync(DateTimeOffset from, DateTimeOffset to, int maxCount, CancellationToken cancellationToken);

    /// <summary>The newest dead letters, newest first.</summary>
    Task<IReadOnlyList<DeadLetterRecord>> GetDeadLettersAsync(int maxCount, CancellationToken cancellationToken);

    /// <summary>Appends an audit entry.</summary>
    Task AppendAuditAsync(AuditEntry entry, CancellationToken cancellationToken);

    /// <summary>The newest audit entries, newest first, at most <paramref name="maxCount"/>.</summary>
    Task<IReadOnlyList<AuditEntry>> GetAuditAsync(int maxCount, CancellationToken cancellationToken);

    /// <summary>Deletes old rows in steps of bounded size.</summary>
    Task<PruneResult> PruneAsync(RetentionPolicy policy, CancellationToken cancellationToken);

    /// <summary>Housekeeping when ingest is idle (SQLite: truncating WAL checkpoint). Cheap to call often.</summary>
    Task MaintainAsync(CancellationToken cancellationToken);

    /// <summary>Performs a small real write to prove the store is writable; throws <see cref="StoreUnavailableException"/> if not.</summary>
    Task ProbeWriteAsync(CancellationToken cancellationToken);
}
