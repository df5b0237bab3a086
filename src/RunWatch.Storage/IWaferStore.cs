namespace RunWatch.Storage;

/// <summary>
/// The wafer pipeline's part of the store: wafers, SEM fields (assigned or waiting), analyses, reports and model
/// fits. Implemented by the same SQLite store as <see cref="IRunWatchStore"/>. Thread-safe.
/// </summary>
public interface IWaferStore
{
    /// <summary>Inserts the wafer if new; sets its run and process when given. Returns it.</summary>
    Task<WaferRecord> UpsertWaferAsync(string name, long? runId, string? process, CancellationToken cancellationToken);

    /// <summary>A wafer by name, or null.</summary>
    Task<WaferRecord?> GetWaferAsync(string name, CancellationToken cancellationToken);

    /// <summary>Wafers, newest first.</summary>
    Task<IReadOnlyList<WaferRecord>> ListWafersAsync(int maxCount, CancellationToken cancellationToken);

    /// <summary>The newest run whose events named <paramref name="wafer"/>, or null.</summary>
    Task<RunRecord?> FindRunOfWaferAsync(string wafer, CancellationToken cancellationToken);

    /// <summary>Stores a field; the same bytes (same SHA-256) stored before return the existing field instead.</summary>
    Task<(FieldRecord Field, bool Added)> AddFieldAsync(FieldRecord field, CancellationToken cancellationToken);

    /// <summary>Updates a field's wafer, status, problem, size and scale.</summary>
    Task<FieldRecord> UpdateFieldAsync(FieldRecord field, CancellationToken cancellationToken);

    /// <summary>A field by id, or null.</summary>
    Task<FieldRecord?> GetFieldAsync(long id, CancellationToken cancellationToken);

    /// <summary>Fields of a wafer, oldest first.</summary>
    Task<IReadOnlyList<FieldRecord>> GetFieldsOfWaferAsync(string wafer, CancellationToken cancellationToken);

    /// <summary>Fields with the given status, oldest first.</summary>
    Task<IReadOnlyList<FieldRecord>> GetFieldsByStatusAsync(FieldStatus status, int maxCount, CancellationToken cancellationToken);

    /// <summary>
    /// Claims the oldest queued field that no worker holds, or whose claim ran out, for <paramref name="worker"/> until
    /// <paramref name="now"/> + <paramref name="lease"/>; null when none is free. Daemons sharing one store each get a
    /// different field (PostgreSQL: <c>FOR UPDATE SKIP LOCKED</c>), so a field is analysed once; the claim ends when
    /// the field leaves <see cref="FieldStatus.Queued"/>, or by <see cref="ReleaseFieldClaimAsync"/>.
    /// </summary>
    Task<FieldRecord?> ClaimQueuedFieldAsync(string worker, DateTimeOffset now, TimeSpan lease, CancellationToken cancellationToken);

    /// <summary>
    /// Claims one queued field for <paramref name="worker"/> until <paramref name="now"/> + <paramref name="lease"/> if no
    /// other worker holds it; false when it is held, or not queued any more. A field is analysed by whoever claims it.
    /// </summary>
    Task<bool> ClaimFieldAsync(long fieldId, string worker, DateTimeOffset now, TimeSpan lease, CancellationToken cancellationToken);

    /// <summary>Gives a claimed field back to the queue at once (the worker stops before analysing it).</summary>
    Task ReleaseFieldClaimAsync(long fieldId, string worker, CancellationToken cancellationToken);

    /// <summary>Stores an analysis and returns it with its id.</summary>
    Task<AnalysisRecord> SaveAnalysisAsync(AnalysisRecord analysis, CancellationToken cancellationToken);

    /// <summary>The newest analysis of a field, or null.</summary>
    Task<AnalysisRecord?> GetLatestAnalysisAsync(long fieldId, CancellationToken cancellationToken);

    /// <summary>Records a written report file.</summary>
    Task<WaferReportRecord> SaveReportAsync(WaferReportRecord report, CancellationToken cancellationToken);

    /// <summary>The newest report files of a wafer (one per format), newest first.</summary>
    Task<IReadOnlyList<WaferReportRecord>> GetReportsAsync(string wafer, CancellationToken cancellationToken);

    /// <summary>For every wafer matched to a run, the verdict of its newest report (one query, for the runs table).</summary>
    Task<IReadOnlyList<RunWaferVerdict>> GetLatestRunVerdictsAsync(CancellationToken cancellationToken);

    /// <summary>Stores a model fit (proposed, or accepted when <see cref="ModelFitRecord.AcceptedAt"/> is set).</summary>
    Task<ModelFitRecord> SaveModelFitAsync(ModelFitRecord fit, CancellationToken cancellationToken);

    /// <summary>Marks a fit accepted by <paramref name="actor"/>.</summary>
    Task<ModelFitRecord?> AcceptModelFitAsync(long id, string actor, CancellationToken cancellationToken);

    /// <summary>Fits of a process and kind, newest first.</summary>
    Task<IReadOnlyList<ModelFitRecord>> GetModelFitsAsync(string process, string model, int maxCount, CancellationToken cancellationToken);
}
