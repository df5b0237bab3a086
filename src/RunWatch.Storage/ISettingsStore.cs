using RunWatch.Core.Qc;

namespace RunWatch.Storage;

/// <summary>
/// Settings an admin edits from the dashboard: QC specifications per recipe and reminder-rule thresholds.
/// Configuration seeds them (insert if missing, never overwrite); each change is written together with its audit
/// entry in one transaction. Implemented by the same SQLite store as <see cref="IRunWatchStore"/>. Thread-safe.
/// </summary>
public interface ISettingsStore
{
    /// <summary>Recipe key of the default specification (used for recipes without their own).</summary>
    const string DefaultRecipe = "";

    /// <summary>All stored specifications, ordered by recipe (the default first).</summary>
    Task<IReadOnlyList<StoredQcSpecification>> GetQcSpecificationsAsync(CancellationToken cancellationToken);

    /// <summary>Stores the specifications whose recipe has none yet, each with an audit entry; returns how many were added.</summary>
    Task<int> SeedQcSpecificationsAsync(IReadOnlyDictionary<string, QcSpecification> specifications, string actor, DateTimeOffset at, CancellationToken cancellationToken);

    /// <summary>
    /// Replaces the recipe's specification and appends <paramref name="audit"/> in the same transaction. With
    /// <paramref name="expectedUpdatedAt"/> the write happens only if the stored row is still the one read then, so
    /// two people editing at once cannot silently undo each other's change.
    /// </summary>
    /// <exception cref="KeyNotFoundException">The recipe has no stored specification.</exception>
    /// <exception cref="InvalidOperationException">The row changed since <paramref name="expectedUpdatedAt"/>; nothing was written.</exception>
    Task SaveQcSpecificationAsync(string recipe, QcSpecification specification, string actor, AuditEntry audit, DateTimeOffset? expectedUpdatedAt,
        CancellationToken cancellationToken);

    /// <summary>All stored reminder settings, ordered by rule id.</summary>
    Task<IReadOnlyList<ReminderSetting>> GetReminderSettingsAsync(CancellationToken cancellationToken);

    /// <summary>Stores the settings whose rule has none yet; returns how many were added.</summary>
    Task<int> SeedReminderSettingsAsync(IReadOnlyList<ReminderSetting> settings, CancellationToken cancellationToken);

    /// <summary>Replaces a rule's setting and appends <paramref name="audit"/> in the same transaction.</summary>
    /// <exception cref="KeyNotFoundException">The rule has no stored setting.</exception>
    Task SaveReminderSettingAsync(ReminderSetting setting, AuditEntry audit, CancellationToken cancellationToken);
}
